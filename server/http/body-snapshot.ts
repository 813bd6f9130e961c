// What the request log keeps of a body: redacted first, then cut at the configured number of
// bytes. Multipart uploads are described (field, file name, size, type), never stored.
import type { Request } from 'express';
import type { CapturedBody } from './response-capture.ts';
import { uploadedFiles } from './uploaded-files.ts';
import type { BodyKind } from '../domain/request-log/body-kinds.ts';
import { redactJson, redactText } from '../domain/request-log/redact.ts';
import { boundDepth } from '../lib/json-shape.ts';

export interface BodySnapshot {
  kind: BodyKind;
  contentType: string | null;
  body: string | null;
  /** Bytes of the original body. */
  size: number;
  truncated: boolean;
  /** Secrets were removed from the body. */
  redacted: boolean;
}

const JSON_TYPE = /^application\/([\w.+-]+\+)?json\b/i;
const TEXT_TYPE = /^(text\/|application\/(xml|x-www-form-urlencoded|csv)\b)/i;

/** Cuts text to at most `limit` UTF-8 bytes without splitting a character. */
export function truncateUtf8(text: string, limit: number): { text: string; truncated: boolean } {
  if (Buffer.byteLength(text) <= limit) return { text, truncated: false };
  const cut = new TextDecoder('utf-8', { fatal: false }).decode(Buffer.from(text).subarray(0, limit));
  return { text: cut.replace(/\uFFFD+$/, ''), truncated: true };
}

function textSnapshot(
  kind: BodyKind,
  contentType: string | null,
  text: string,
  size: number,
  limit: number,
  cutBefore = false,
  redacted = false,
): BodySnapshot {
  const r = redactText(text);
  const { text: body, truncated } = truncateUtf8(r.value, limit);
  return { kind, contentType, body, size, truncated: truncated || cutBefore, redacted: redacted || r.redacted };
}

/** Levels of JSON the log keeps; deeper parts become a marker (and the entry is marked truncated). */
const KEPT_DEPTH = 64;

/** `size` undefined: the size of the JSON text. Depth-safe: redaction and JSON.stringify see KEPT_DEPTH levels at most. */
function jsonSnapshot(kind: BodyKind, contentType: string | null, value: unknown, size: number | undefined, limit: number): BodySnapshot {
  const bounded = boundDepth(value, KEPT_DEPTH, `[nested deeper than ${KEPT_DEPTH} levels]`);
  const r = redactJson(bounded.value);
  const text = JSON.stringify(r.value) ?? 'null';
  return textSnapshot(kind, contentType, text, size ?? Buffer.byteLength(text), limit, bounded.cut, r.redacted);
}

const none = (contentType: string | null): BodySnapshot => ({
  kind: 'none',
  contentType,
  body: null,
  size: 0,
  truncated: false,
  redacted: false,
});

export function snapshotRequestBody(req: Request, limit: number): BodySnapshot {
  const contentType = req.get('content-type') ?? null;
  const declared = Number(req.get('content-length') ?? 0) || 0;
  const body: unknown = req.body;
  if (contentType && /^multipart\//i.test(contentType)) {
    const files = uploadedFiles(req).map((f) => ({ field: f.fieldname, name: f.originalname, size: f.size, content_type: f.mimetype }));
    // Only the text fields: an upload route may have put the file object itself on the body.
    const fields = Object.fromEntries(
      Object.entries((body ?? {}) as Record<string, unknown>).filter(([, value]) => typeof value !== 'object' || value === null),
    );
    return jsonSnapshot('multipart', contentType, { fields, files }, declared, limit);
  }
  if (body === undefined || body === null) {
    return declared > 0 ? { ...none(contentType), kind: 'unread', size: declared } : none(contentType);
  }
  if (Buffer.isBuffer(body)) {
    if (contentType && (TEXT_TYPE.test(contentType) || JSON_TYPE.test(contentType)))
      return textSnapshot('text', contentType, body.toString('utf8'), body.length, limit);
    return { kind: 'binary', contentType, body: null, size: body.length, truncated: false, redacted: false };
  }
  if (typeof body === 'string') return textSnapshot('text', contentType, body, Buffer.byteLength(body), limit);
  return jsonSnapshot('json', contentType, body, declared || undefined, limit);
}

/** JSON answers up to this size are parsed before redaction; larger ones are redacted as text. */
const PARSED_UP_TO_BYTES = 4096;

export function snapshotResponseBody(contentType: string | null, captured: CapturedBody, limit: number): BodySnapshot {
  if (captured.size === 0) return none(contentType);
  const isJson = !!contentType && JSON_TYPE.test(contentType);
  // A JSON answer above a few KB (a sample, a list page) is redacted as text instead of being
  // parsed, walked and written again: Meltwire writes compact JSON, so the text is the one the
  // parsed path would give, and text redaction handles a value cut in the middle, so only the
  // first bytes of a large answer are read at all. Small answers (a new key with its secret) take
  // the parsed path, which also redacts secret-named fields holding objects.
  if (isJson && captured.complete && captured.size > PARSED_UP_TO_BYTES) {
    const cut = captured.size > limit * 2;
    const text = new TextDecoder('utf-8', { fatal: false }).decode(cut ? captured.body.subarray(0, limit * 2) : captured.body);
    return textSnapshot('json', contentType, text, captured.size, limit, cut);
  }
  if (isJson && captured.complete) {
    try {
      return jsonSnapshot('json', contentType, JSON.parse(captured.body.toString('utf8')), captured.size, limit);
    } catch {
      // Not valid JSON after all: keep it as text.
    }
  }
  if (isJson || (contentType && TEXT_TYPE.test(contentType))) {
    return textSnapshot(isJson ? 'json' : 'text', contentType, captured.body.toString('utf8'), captured.size, limit, !captured.complete);
  }
  return { kind: 'binary', contentType, body: null, size: captured.size, truncated: false, redacted: false };
}
