// Trainers' review comments on past logbook records. A comment is visible to the people involved
// in the record — whoever wrote it and the crew on shift then — and to those who review
// (trainers, shift leads, administrators). Comments are only inserted.
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { NotFound } from '../../lib/errors';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { namesOf } from '../users/index';
import { mayReadReviewComment } from '../../../shared/policies/review';
import { ReviewComment } from './model';
import type { ReviewCommentView } from '../../../shared/schemas/logbook';


type DocumentRow = { id: number; kind: string; refId: number; unitId: number | null; shiftStart: Date | null; personId: number | null; crewId: number | null; title: string };

/** Logbook documents matching a WHERE clause, by id. */
async function readDocuments(sequelize: Sequelize, where: string, replacements: unknown[] = []) {
  const rows = await sequelize.query<DocumentRow>(
    `SELECT id, kind, ref_id AS refId, unit_id AS unitId, shift_start AS shiftStart, person_id AS personId, crew_id AS crewId, title
     FROM logbook_documents WHERE ${where}`,
    { replacements, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [Number(r.id), { ...r, id: Number(r.id), refId: Number(r.refId) }]));
}

const documentsById = (sequelize: Sequelize, ids: number[]) =>
  ids.length ? readDocuments(sequelize, `id IN (${ids.map(Number).join(',')})`) : Promise.resolve(new Map<number, DocumentRow>());

const mayRead = (viewer: Express.User, doc: Pick<DocumentRow, 'personId' | 'crewId'>) => mayReadReviewComment(viewer, doc);

/** The comments on these documents that the viewer may read, oldest first. */
export async function commentsOn(sequelize: Sequelize, viewer: Express.User, documentIds: number[]) {
  if (documentIds.length === 0) return [];
  const docs = await documentsById(sequelize, documentIds);
  const comments = await ReviewComment.findAll({ where: { documentId: documentIds }, order: [['id', 'ASC']] });
  return present(comments.filter((c) => mayRead(viewer, docs.get(c.documentId)!)), docs);
}

async function present(comments: ReviewComment[], docs: Map<number, DocumentRow>): Promise<ReviewCommentView[]> {
  const authors = await namesOf(comments.map((c) => c.authorId));
  return comments.map((c) => {
    const doc = docs.get(c.documentId)!;
    return {
      id: c.id,
      documentId: c.documentId,
      kind: doc.kind,
      refId: doc.refId,
      unitId: doc.unitId,
      shiftStart: doc.shiftStart ? new Date(doc.shiftStart).toISOString() : null,
      about: doc.title,
      author: authors.get(c.authorId) ?? `#${c.authorId}`,
      body: c.body,
      createdAt: c.createdAt.toISOString(),
    };
  });
}

export function makeReviewCommentService(sequelize: Sequelize) {
  async function add(actor: Express.User, input: { documentId: number; body: string }) {
    const doc = (await documentsById(sequelize, [input.documentId])).get(input.documentId);
    if (!doc) throw new NotFound('That logbook record');
    const comment = await unitOfWork(sequelize, async (transaction) => {
      const created = await ReviewComment.create({ documentId: doc.id, authorId: actor.id, body: input.body, createdAt: new Date() }, { transaction });
      await recordAudit({ actorId: actor.id, action: 'logbook.review_comment', entity: 'review_comment', entityId: created.id }, transaction);
      // The record's author hears at once; a record without one (a flag) has nobody to tell.
      if (doc.personId) publish(transaction, { entity: 'review_comment', id: created.id, userId: doc.personId });
      return created;
    });
    return (await present([comment], new Map([[doc.id, doc]])))[0]!;
  }

  /** Comments on records the person wrote or that their crew's shifts produced, newest first. */
  async function forPerson(viewer: Express.User, limit = 50) {
    const mine = viewer.crewId !== null ? '(person_id = ? OR crew_id = ?)' : 'person_id = ?';
    const byId = await readDocuments(
      sequelize,
      `id IN (SELECT document_id FROM review_comments) AND ${mine}`,
      viewer.crewId !== null ? [viewer.id, viewer.crewId] : [viewer.id],
    );
    if (byId.size === 0) return [];
    const comments = await ReviewComment.findAll({ where: { documentId: { [Op.in]: [...byId.keys()] } }, order: [['id', 'DESC']], limit });
    return present(comments, byId);
  }

  return { add, forPerson };
}
export type ReviewCommentService = ReturnType<typeof makeReviewCommentService>;
