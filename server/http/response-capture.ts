// Tees what a handler writes to the response, up to a cap, so the request log and the
// idempotency store can keep it. The hook runs when the handler ends the response; when it
// returns a promise, the end waits for it (so a stored idempotent response exists before the
// client can retry).
import type { Response } from 'express';

export interface CapturedBody {
  /** The first `cap` bytes written. */
  body: Buffer;
  /** Every byte written, including those beyond the cap. */
  size: number;
  /** False when the body was larger than the cap. */
  complete: boolean;
}

type Chunk = string | Buffer | Uint8Array;
type EndArgs = [chunk?: unknown, encoding?: unknown, callback?: unknown];

function toBuffer(chunk: Chunk, encoding: unknown): Buffer {
  if (typeof chunk === 'string') return Buffer.from(chunk, typeof encoding === 'string' ? (encoding as BufferEncoding) : 'utf8');
  return Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength);
}

export function captureResponse(res: Response, cap: number, onEnd: (captured: CapturedBody) => void | Promise<void>): void {
  const parts: Buffer[] = [];
  let kept = 0;
  let size = 0;
  let ending = false;

  const collect = (chunk: unknown, encoding: unknown) => {
    if (chunk === undefined || chunk === null || typeof chunk === 'function') return;
    const buffer = toBuffer(chunk as Chunk, encoding);
    size += buffer.length;
    if (kept < cap) {
      const slice = buffer.subarray(0, cap - kept);
      parts.push(Buffer.from(slice));
      kept += slice.length;
    }
  };

  const originalWrite = res.write.bind(res) as (...args: unknown[]) => boolean;
  const originalEnd = res.end.bind(res) as (...args: unknown[]) => Response;

  res.write = ((chunk: unknown, encoding?: unknown, callback?: unknown) => {
    collect(chunk, encoding);
    return originalWrite(chunk, encoding, callback);
  }) as Response['write'];

  res.end = ((...args: EndArgs) => {
    if (ending) return res;
    ending = true;
    collect(args[0], args[1]);
    let pending: void | Promise<void>;
    try {
      pending = onEnd({ body: Buffer.concat(parts), size, complete: size <= cap });
    } catch {
      pending = undefined;
    }
    if (pending && typeof pending.then === 'function') {
      const finish = () => originalEnd(...args);
      pending.then(finish, finish);
      return res;
    }
    return originalEnd(...args);
  }) as Response['end'];
}
