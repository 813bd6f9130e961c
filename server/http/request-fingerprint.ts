// What makes two requests "the same" for Idempotency-Key: method, path, JSON body and any
// uploaded files (multer's memory or disk storage), hashed together.
import { createHash, type Hash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import type { Request } from 'express';
import { uploadedFiles } from './uploaded-files.ts';

/** JSON with object keys sorted, so {a,b} and {b,a} hash alike. */
function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object' && !Buffer.isBuffer(value)) {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  if (Buffer.isBuffer(value)) return JSON.stringify(`base64:${value.toString('base64')}`);
  return JSON.stringify(value) ?? 'null';
}

async function hashFileContent(hash: Hash, file: Express.Multer.File): Promise<void> {
  if (file.buffer) {
    hash.update(file.buffer);
    return;
  }
  if (file.path) {
    for await (const chunk of createReadStream(file.path)) hash.update(chunk as Buffer);
  }
}

/** SHA-256 (hex) of everything that identifies the request: method, path with query, body, files. */
export async function fingerprintRequest(req: Request): Promise<string> {
  const hash = createHash('sha256');
  hash.update(`${req.method} ${req.originalUrl}\n`);
  hash.update(canonicalJson(req.body ?? null));
  for (const file of uploadedFiles(req)) {
    hash.update(`\nfile ${file.fieldname} ${file.originalname} ${file.mimetype} ${file.size}\n`);
    await hashFileContent(hash, file);
  }
  return hash.digest('hex');
}
