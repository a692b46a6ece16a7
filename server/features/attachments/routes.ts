import { Router } from 'express';
import { attachmentReasonSchema } from '../../../shared/schemas/handovers';
import { allow, signedIn } from '../../lib/auth';
import { singleFileUpload } from '../../lib/upload';
import { parseId, parseInput } from '../../lib/validate';
import { MAX_ATTACHMENT_BYTES, type AttachmentService } from './service';

const upload = singleFileUpload({ fileSize: MAX_ATTACHMENT_BYTES }, 'The file is larger than 10 MB');

export function attachmentRoutes(attachments: AttachmentService): Router {
  const router = Router();

  router.post('/handover-items/:id/attachments', allow('handover.attach'), upload, async (req, res) => {
    const { reason } = parseInput(attachmentReasonSchema, { reason: typeof req.body?.reason === 'string' && req.body.reason.trim() ? req.body.reason : undefined });
    const attachment = await attachments.add(req.user!, parseId(req.params.id), req.file, reason);
    res.status(201).json({ id: attachment.id, mime: attachment.mime, fileName: attachment.fileName, amendmentId: attachment.amendmentId });
  });

  router.get('/attachments/:id', signedIn, async (req, res) => {
    const { attachment, bytes } = await attachments.read(parseId(req.params.id));
    res.setHeader('Content-Type', attachment.mime);
    // Downloaded, never rendered as a page of ours; and nothing in it may run even if opened.
    res.setHeader('Content-Disposition', `attachment; filename="${attachment.fileName}"`);
    res.setHeader('Content-Security-Policy', "sandbox; default-src 'none'");
    res.send(bytes);
  });

  return router;
}
