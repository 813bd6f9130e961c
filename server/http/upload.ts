// Multipart uploads (multer, in memory: the bytes are hashed and stored whole anyway).
// Multer's and busboy's errors become problems; the file is moved onto req.body so the route's zod
// schema checks it with the other fields.
import type { RequestHandler } from 'express';
import multer from 'multer';
import { MalformedBodyProblem, ProblemError, ValidationProblem } from '../lib/problems.ts';

export function singleFileUpload(field: string, maxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 20, fieldSize: 10_000 },
  }).single(field);
  return (req, res, next) => {
    upload(req, res, (error: unknown) => {
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          // limit_bytes lets a client state the limit in its own words without parsing the detail.
          return next(
            new ProblemError(
              413,
              'payload-too-large',
              'File too large',
              `The file exceeds the limit of ${maxBytes} bytes (IMPORT_MAX_BYTES).`,
              { limit_bytes: maxBytes },
            ),
          );
        }
        return next(
          new ValidationProblem([{ location: `body.${error.field ?? field}`, message: error.message, code: error.code.toLowerCase() }]),
        );
      }
      // Anything else comes from reading the multipart stream (busboy): no boundary, a truncated
      // body, a broken part header. The client sent it, so it is a 400, not a server error.
      if (error) {
        const reason = error instanceof Error ? error.message : String(error);
        return next(new MalformedBodyProblem('Malformed multipart body', `The multipart/form-data body cannot be read: ${reason}.`));
      }
      if (!req.is('multipart/form-data')) {
        return next(
          new ProblemError(
            415,
            'unsupported-media-type',
            'Unsupported media type',
            'Send the file as multipart/form-data with the field "file".',
          ),
        );
      }
      req.body = { ...(req.body ?? {}), [field]: req.file };
      next();
    });
  };
}
