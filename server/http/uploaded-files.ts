/// <reference types="multer" />
import type { Request } from 'express';

/** Files a route's multer middleware attached: `req.file`, `req.files` as a list or by field. */
export function uploadedFiles(req: Request): Express.Multer.File[] {
  const files: Express.Multer.File[] = [];
  if (req.file) files.push(req.file);
  if (Array.isArray(req.files)) files.push(...req.files);
  else if (req.files) for (const list of Object.values(req.files)) files.push(...list);
  return files;
}
