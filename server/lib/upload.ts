// One file per request, read into memory, with every way an upload can be broken answered as a 400
// on `file` (a cut-off body, no boundary, a mangled part header, a name with control characters)
// instead of reaching the error handler as an unknown failure.
import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError, ValidationError } from './errors';
import { hasUnstorableText } from './validate';

// Control characters (NUL included) have no place in a file name and break headers and logs.
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001f\u007f]/;

export function singleFileUpload(limits: { fileSize: number; fields?: number; fieldSize?: number }, tooLarge: string): RequestHandler {
  const upload = multer({ storage: multer.memoryStorage(), limits: { files: 1, fields: 5, ...limits } }).single('file');
  return (req, res, next) => {
    upload(req, res, (error?: unknown) => {
      if (error) return next(uploadError(error, tooLarge));
      const name = req.file?.originalname;
      if (name !== undefined && (CONTROL.test(name) || hasUnstorableText(name))) {
        return next(new ValidationError({ file: 'The file name holds characters that are not allowed; rename the file and choose it again' }));
      }
      next();
    });
  };
}

function uploadError(error: unknown, tooLarge: string): Error {
  const code = (error as { code?: string }).code;
  if (code === 'LIMIT_FILE_SIZE') return new HttpError(413, 'TOO_LARGE', tooLarge, { file: tooLarge });
  if (code === 'LIMIT_FILE_COUNT' || code === 'LIMIT_UNEXPECTED_FILE') return new ValidationError({ file: 'Send one file, in the file box' });
  if (code?.startsWith('LIMIT_')) return new ValidationError({ file: 'The form sent with the file is larger than this form sends; reload the page and try again' });
  // Everything else comes from the multipart parser: the body was cut off or is not a form at all.
  return new ValidationError({ file: 'The upload arrived incomplete or garbled; choose the file and send it again' });
}
