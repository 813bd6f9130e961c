// What makes two requests "the same" for Idempotency-Key: method, path, JSON body and any
// uploaded files (multer's memory or disk storage), hashed together.
import { createHash, type Hash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import type { Request } from 'express';
import { uploadedFiles } from './uploaded-files.ts';

/** Text written as is by canonicalJson (brackets, separators, encoded keys). */
class Token {
  constructor(readonly text: string) {}
}

/**
 * JSON with object keys sorted, so {a,b} and {b,a} hash alike. Written with an explicit stack:
 * a body nested thousands of levels deep must not overflow the call stack.
 */
function canonicalJson(root: unknown): string {
  const out: string[] = [];
  const stack: unknown[] = [root];
  /** An array element or an object member: the key token (none in arrays), then the value. */
  type Item = [Token | null, unknown];
  const pushReversed = (open: string, close: string, items: Item[]) => {
    stack.push(new Token(close));
    for (let i = items.length - 1; i >= 0; i -= 1) {
      stack.push(items[i][1]);
      if (items[i][0]) stack.push(items[i][0]);
      if (i > 0) stack.push(new Token(','));
    }
    stack.push(new Token(open));
  };
  while (stack.length > 0) {
    const value = stack.pop();
    if (value instanceof Token) {
      out.push(value.text);
    } else if (Buffer.isBuffer(value)) {
      out.push(JSON.stringify(`base64:${value.toString('base64')}`));
    } else if (Array.isArray(value)) {
      const items = value.map((v): Item => [null, v]);
      pushReversed('[', ']', items);
    } else if (value && typeof value === 'object') {
      const entries = Object.entries(value as Record<string, unknown>)
        .filter(([, v]) => v !== undefined)
        .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
      const items = entries.map(([k, v]): Item => [new Token(`${JSON.stringify(k)}:`), v]);
      pushReversed('{', '}', items);
    } else {
      out.push(JSON.stringify(value) ?? 'null');
    }
  }
  return out.join('');
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
