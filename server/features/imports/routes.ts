import { Router, type RequestHandler } from 'express';
import { importMappingSchema } from '../../../shared/schemas/imports';
import { allow } from '../../lib/auth';
import { ValidationError } from '../../lib/errors';
import { singleFileUpload } from '../../lib/upload';
import { parseId, parseInput } from '../../lib/validate';
import { MAX_IMPORT_BYTES } from './parse-csv';
import { analyseImport, inspectFile, rememberedMappings, type ImportService } from './service';

const upload = singleFileUpload({ fileSize: MAX_IMPORT_BYTES, fieldSize: 64 * 1024 }, 'The file is larger than 10 MB; split it and import the parts');
const mayImport = allow('import.run');
// Authorize before reading a byte of the upload.
const withFile: RequestHandler[] = [mayImport, upload];

function fileOf(req: Express.Request): Buffer {
  if (!req.file) throw new ValidationError({ file: 'Choose a CSV file' });
  return req.file.buffer;
}

function mappingOf(body: unknown) {
  const text = (body as { mapping?: unknown })?.mapping;
  if (typeof text !== 'string') throw new ValidationError({ mapping: 'Map the columns first' });
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new ValidationError({ mapping: 'The mapping is not valid JSON' });
  }
  return parseInput(importMappingSchema, json);
}

export function importRoutes(imports: ImportService): Router {
  const router = Router();

  router.get('/units/:unitId/import-mappings', mayImport, async (req, res) => {
    res.json({ mappings: await rememberedMappings(parseId(req.params.unitId, 'unitId')) });
  });

  /** Step 1: the file's columns and a few rows, to map them. */
  router.post('/units/:unitId/imports/inspect', ...withFile, async (req, res) => {
    res.json(await inspectFile(parseId(req.params.unitId, 'unitId'), fileOf(req)));
  });

  /** Step 2: every row checked against the mapping; nothing stored. */
  router.post('/units/:unitId/imports/preview', ...withFile, async (req, res) => {
    const analysis = await analyseImport(parseId(req.params.unitId, 'unitId'), fileOf(req), mappingOf(req.body));
    res.json({ timeZone: analysis.timeZone, counts: analysis.counts, rows: analysis.reports.slice(0, 1000) });
  });

  /** Step 3: store the valid rows, a batch per transaction, and report the rest. */
  router.post('/units/:unitId/imports', ...withFile, async (req, res) => {
    const result = await imports.commit(req.user!, parseId(req.params.unitId, 'unitId'), fileOf(req), mappingOf(req.body));
    res.status(201).json(result);
  });

  return router;
}
