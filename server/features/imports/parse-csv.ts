// A historian or spreadsheet export → header + rows, refusing what is not a text CSV.
import Papa from 'papaparse';
import { ValidationError } from '../../lib/errors';

export const MAX_IMPORT_BYTES = 10 * 1024 * 1024;
export const MAX_IMPORT_ROWS = 100_000;

export type ParsedCsv = { headers: string[]; rows: Record<string, string>[] };

export function parseCsv(buffer: Buffer): ParsedCsv {
  if (buffer.length === 0) throw new ValidationError({ file: 'The file is empty' });
  if (buffer.subarray(0, 8192).includes(0)) throw new ValidationError({ file: 'This is a binary file, not a CSV text export' });
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new ValidationError({ file: 'The file is not UTF-8 text; export it again as CSV (UTF-8)' });
  }
  const result = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim(),
  });
  const headers = (result.meta.fields ?? []).filter((h) => h !== '');
  // A header row has names, not numbers: a file that starts with data has no header.
  if (headers.length < 2 || headers.every((h) => /^[-+]?\d/.test(h))) {
    throw new ValidationError({ file: 'No header row found: the first line must name the columns' });
  }
  if (result.data.length === 0) throw new ValidationError({ file: 'The file has a header but no rows' });
  if (result.data.length > MAX_IMPORT_ROWS) {
    throw new ValidationError({ file: `At most ${MAX_IMPORT_ROWS.toLocaleString('en-GB')} rows per import; split the file` });
  }
  return { headers, rows: result.data };
}
