// Secret removal for the request log: credentials headers, JSON fields with secret-sounding
// names, and anything shaped like an API key, wherever it appears.
import { KEY_PREFIX } from '../api-keys/key-format.ts';

const REDACTED = '[redacted]';

/** Field, header and query names whose values are never logged. */
const SECRET_NAME = /password|secret|token|api[-_]?key|authorization|cookie/i;

/**
 * An API key, or the start of one longer than the public display prefix (mw_live_ + 6 characters)
 * that lists already show.
 */
const KEY_TEXT = new RegExp(`${KEY_PREFIX}[0-9A-Za-z]{7,}`, 'g');

/** A webhook signing secret (`whsec_` + base64), wherever it appears. */
const WEBHOOK_SECRET_TEXT = /whsec_[A-Za-z0-9+/=]{8,}/g;

/** `?token=…` / `&api_key=…` in links inside any text (an e-mail's invitation link, a Referer). */
const SECRET_URL_PARAM = /([?&](?:[\w.-]*(?:password|secret|token|api[-_]?key)[\w.-]*)=)[^&#\s"'<>]+/gi;

/** `"password": "…"` pairs in text that is not parseable JSON (a truncated body). */
const SECRET_PAIR =
  /("(?:[^"\\]*(?:password|secret|token|api[-_]?key|authorization|cookie)[^"\\]*)"\s*:\s*)("(?:[^"\\]|\\.)*(?:"|$)|[^,}\]\s]+)/gi;

function isSecretName(name: string): boolean {
  return SECRET_NAME.test(name);
}

export interface Redacted<T> {
  value: T;
  /** True when something was removed. */
  redacted: boolean;
}

export function redactText(text: string): Redacted<string> {
  const value = text
    .replace(KEY_TEXT, `${KEY_PREFIX}${REDACTED}`)
    .replace(WEBHOOK_SECRET_TEXT, `whsec_${REDACTED}`)
    .replace(SECRET_PAIR, `$1"${REDACTED}"`)
    .replace(SECRET_URL_PARAM, `$1${REDACTED}`);
  return { value, redacted: value !== text };
}

/** Redacts a parsed JSON value: secret-named fields lose their values, strings lose key shapes. */
export function redactJson(input: unknown): Redacted<unknown> {
  let redacted = false;
  const walk = (value: unknown): unknown => {
    if (typeof value === 'string') {
      const r = redactText(value);
      redacted ||= r.redacted;
      return r.value;
    }
    if (Array.isArray(value)) return value.map(walk);
    if (value && typeof value === 'object') {
      return Object.fromEntries(
        Object.entries(value as Record<string, unknown>).map(([key, v]) => {
          if (isSecretName(key) && v !== null && v !== undefined) {
            redacted = true;
            return [key, REDACTED];
          }
          return [key, walk(v)];
        }),
      );
    }
    return value;
  };
  const value = walk(input);
  return { value, redacted };
}

/** Header values as strings; Authorization keeps its scheme so the log shows how the caller authenticated. */
export function redactHeaders(headers: Record<string, string | string[] | number | undefined>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [rawName, rawValue] of Object.entries(headers)) {
    if (rawValue === undefined) continue;
    const name = rawName.toLowerCase();
    const value = Array.isArray(rawValue) ? rawValue.join(', ') : String(rawValue);
    if (name === 'authorization') out[name] = `${value.split(/\s+/)[0]} ${REDACTED}`;
    else if (isSecretName(name)) out[name] = REDACTED;
    else out[name] = redactText(value).value;
  }
  return out;
}

/** A raw query string (without "?"); kept byte for byte unless something had to be removed. */
export function redactQuery(query: string): Redacted<string> {
  if (!query) return { value: '', redacted: false };
  const params = new URLSearchParams(query);
  let redacted = false;
  const out = new URLSearchParams();
  for (const [name, value] of params) {
    if (isSecretName(name)) {
      redacted = true;
      out.append(name, REDACTED);
    } else {
      const r = redactText(value);
      redacted ||= r.redacted;
      out.append(name, r.value);
    }
  }
  return redacted ? { value: out.toString(), redacted } : { value: query, redacted: false };
}

/** A request URL (path and query): key-shaped text anywhere, query parameters by name. */
export function redactUrl(url: string): Redacted<string> {
  const [path, query] = url.split(/\?(.*)/s, 2);
  const cleanPath = redactText(path);
  const cleanQuery = query === undefined ? undefined : redactQuery(query);
  return {
    value: cleanQuery === undefined ? cleanPath.value : `${cleanPath.value}?${cleanQuery.value}`,
    redacted: cleanPath.redacted || (cleanQuery?.redacted ?? false),
  };
}

/** Headers a log line may show; every other header is left out of the process log. */
const LOGGED_HEADERS = new Set([
  'host',
  'user-agent',
  'content-type',
  'content-length',
  'accept',
  'origin',
  'x-request-id',
  'idempotency-key',
]);

/** The allow-listed headers, redacted like the request log's: what the process log shows of a request or response. */
export function headersForLog(headers: Record<string, string | string[] | number | undefined>): Record<string, string> {
  const kept = Object.fromEntries(Object.entries(headers).filter(([name]) => LOGGED_HEADERS.has(name.toLowerCase())));
  return redactHeaders(kept);
}
