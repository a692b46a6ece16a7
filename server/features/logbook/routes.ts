import { Router } from 'express';
import { logbookSearchSchema, reviewCommentSchema } from '../../../shared/schemas/logbook';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import type { ReviewCommentService } from './review-comments';
import type { LogbookService } from './service';

const mayComment = allow('review.comment');

export function logbookRoutes(logbook: LogbookService, comments: ReviewCommentService): Router {
  const router = Router();

  router.get('/logbook/search', signedIn, async (req, res) => {
    res.json(await logbook.search(parseInput(logbookSearchSchema, req.query)));
  });

  router.get('/logbook/search.csv', signedIn, async (req, res) => {
    const csv = await logbook.searchCsv(parseInput(logbookSearchSchema, req.query));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="hotwell-logbook-search.csv"');
    res.send(csv);
  });

  router.get('/logbook/units/:unitId/shifts/:shiftStart', signedIn, async (req, res) => {
    res.json(await logbook.shift(req.user!, parseId(req.params.unitId, 'unitId'), String(req.params.shiftStart)));
  });

  router.post('/logbook/review-comments', mayComment, async (req, res) => {
    res.status(201).json({ comment: await comments.add(req.user!, parseInput(reviewCommentSchema, req.body)) });
  });

  router.get('/logbook/review-comments/mine', signedIn, async (req, res) => {
    res.json({ comments: await comments.forPerson(req.user!) });
  });

  return router;
}
