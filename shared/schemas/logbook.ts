import { z } from 'zod';
import './messages';

export const documentKindLabels = {
  log_entry: 'Log entry',
  log_amendment: 'Log amendment',
  standing_order: 'Standing order',
  handover_notes: 'Handover notes',
  handover_item: 'Handover item',
  handover_query: 'Handover question',
  handover_amendment: 'Handover amendment',
  flag: 'Flag',
  round: 'Round',
  condition: 'Time-limited condition',
} as const;
export type DocumentKindKey = keyof typeof documentKindLabels;

const id = z.coerce.number().int().positive();
const isoDate = z.iso.date({ message: 'Give the date as YYYY-MM-DD' });

/** Search filters as they arrive in the query string. Text is searched as words, never as syntax. */
export const logbookSearchSchema = z
  .object({
    q: z.string().max(200, 'Search text is limited to 200 characters').optional().default(''),
    unitId: id.optional(),
    crewId: id.optional(),
    personId: id.optional(),
    kind: z.enum(Object.keys(documentKindLabels) as [DocumentKindKey, ...DocumentKindKey[]]).optional(),
    severity: z.enum(['watch', 'alarm', 'high']).optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
    page: z.coerce.number().int().min(1).max(1000).optional().default(1),
    pageSize: z.coerce.number().int().min(1).max(100).optional().default(25),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { message: 'The start date is after the end date', path: ['to'] });
export type LogbookSearch = z.infer<typeof logbookSearchSchema>;

export const reviewCommentSchema = z.object({
  documentId: z.number().int().positive(),
  body: z.string().trim().min(3, 'Write the comment (at least 3 characters)').max(4000, 'At most 4 000 characters'),
});

/** One search result, as the API sends it. */
export type SearchHit = {
  documentId: number;
  kind: string;
  refId: number;
  unitId: number | null;
  unitName: string | null;
  occurredAt: string;
  shiftStart: string | null;
  crewName: string | null;
  personName: string | null;
  severity: string | null;
  title: string;
  snippet: string;
  exactPhrase: boolean;
};

/** A trainer's review comment with the record it is about. */
export type ReviewCommentView = {
  id: number;
  documentId: number;
  kind: string;
  refId: number;
  unitId: number | null;
  shiftStart: string | null;
  about: string;
  author: string;
  body: string;
  createdAt: string;
};
