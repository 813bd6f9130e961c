// What each problem `type` means and what to do about it: the text of the page each type URI
// (/problems/<slug>) opens. Every slug the server raises has an entry (tests/api/problem-pages.test.ts
// finds them in the code); other 4xx statuses passed on from Express get a page from their status.
import { STATUS_CODES } from 'node:http';

export interface ProblemTypeDoc {
  slug: string;
  status: number;
  title: string;
  /** When a client gets it. */
  meaning: string;
  /** What to do, one step per entry. */
  remedy: string[];
  /** Members beyond type, title, status, detail, instance and request_id. */
  extensions?: Record<string, string>;
}

export const PROBLEM_TYPES: ProblemTypeDoc[] = [
  {
    slug: 'validation-failed',
    status: 400,
    title: 'Request validation failed',
    meaning:
      'A path parameter, query parameter or body field does not match the operation in the API reference: missing, of the wrong type, out of its limits or not one of the allowed values. Nothing was stored.',
    remedy: [
      'Read errors[]: each entry names the field (location, such as body.name or query.limit), says what is wrong in words (message) and gives a stable code.',
      'Correct those fields and send the request again; the rest of the request was fine.',
    ],
    extensions: { errors: 'One entry per field: location, message and code.' },
  },
  {
    slug: 'malformed-json',
    status: 400,
    title: 'Malformed JSON body',
    meaning: 'The body was sent as JSON but cannot be parsed: a missing quote or comma, a trailing comma, or text that is not JSON.',
    remedy: ['Check the body with a JSON parser before sending it.', 'Send Content-Type: application/json only with a JSON body.'],
  },
  {
    slug: 'json-too-deep',
    status: 400,
    title: 'JSON body nested too deeply',
    meaning: 'The JSON body nests objects and arrays deeper than any Meltwire operation needs; the server stops reading it.',
    remedy: ['Send the structure the operation documents; no request needs deep nesting.'],
    extensions: { max_depth: 'The deepest nesting the server reads.' },
  },
  {
    slug: 'malformed-body',
    status: 400,
    title: 'Malformed body',
    meaning:
      'The body is not what its headers say: not gzip though sent with Content-Encoding: gzip, or a multipart/form-data body without its boundary or cut short.',
    remedy: [
      'Send the body uncompressed, or compressed exactly as Content-Encoding declares.',
      'For uploads let your HTTP client build the multipart body (curl -F file=@results.csv).',
    ],
  },
  {
    slug: 'malformed-url',
    status: 400,
    title: 'Malformed URL',
    meaning: 'The path or query cannot be decoded, for example percent-encoding such as "%ZZ".',
    remedy: ['Percent-encode values in the URL (write a literal "%" as "%25"); most HTTP clients do this for query parameters.'],
  },
  {
    slug: 'unstorable-value',
    status: 400,
    title: 'A value cannot be stored',
    meaning:
      'A value in the request cannot be stored: a NUL character in text, text longer than the field allows, or a number out of range.',
    remedy: ['Remove control characters and keep text and numbers within the limits in the API reference.'],
  },
  {
    slug: 'unauthorized',
    status: 401,
    title: 'Authentication required',
    meaning:
      'The request has no credentials, or they do not work: an unknown, mistyped, revoked or expired API key, the key of a disabled user, or an expired console session.',
    remedy: [
      'Send the key as the header Authorization: Bearer mw_live_….',
      'detail says which of the reasons applies; issue a new key on the console’s API keys page when the old one is revoked or expired.',
    ],
  },
  {
    slug: 'forbidden',
    status: 403,
    title: 'Not allowed',
    meaning:
      'The caller is known but may not do this: the API key lacks the scope, the role does not allow it, or the key is restricted to some instruments.',
    remedy: [
      'required_scope names the scope the operation needs; issue a key that carries it (keys never hold more than their owner’s role allows).',
      'A key restricted to instruments cannot change lab-wide settings; use a key without that restriction.',
    ],
    extensions: {
      required_scope: 'The scope the operation needs, when a scope is missing.',
      restricted_to_instruments: 'The instruments the key is limited to, when that is the reason.',
    },
  },
  {
    slug: 'cross-site-request',
    status: 403,
    title: 'Cross-site request refused',
    meaning:
      'A call that changes data came with the console’s session cookie from another site (its Origin is not this server). This protects a signed-in user from pages that would act in their name.',
    remedy: [
      'Integrations send an API key (Authorization: Bearer …), which is not affected.',
      'In a browser, use the console on its own address.',
    ],
  },
  {
    slug: 'not-found',
    status: 404,
    title: 'Not found',
    meaning: 'There is no such resource or operation, or it is not visible to the caller.',
    remedy: ['Check the id and the path against the API reference; ids are returned by the list and create operations.'],
  },
  {
    slug: 'conflict',
    status: 409,
    title: 'Conflict with the current state',
    meaning:
      'The request is valid but clashes with what is stored: a duplicate code or name, a change the resource’s current state does not allow, or a retry while the first call with the same Idempotency-Key is still running.',
    remedy: ['Read detail, fetch the resource again to see its current state, and decide whether the change still applies.'],
  },
  {
    slug: 'payload-too-large',
    status: 413,
    title: 'Request body too large',
    meaning: 'The body or the uploaded file is larger than the server accepts.',
    remedy: ['Split a large batch into several requests, or a large file into several files.'],
    extensions: { limit_bytes: 'The largest file accepted, for uploads.' },
  },
  {
    slug: 'unsupported-media-type',
    status: 415,
    title: 'Unsupported media type',
    meaning: 'The body is in a form this operation does not read: another Content-Type, Content-Encoding or character set.',
    remedy: ['Send JSON as application/json in UTF-8, and files as multipart/form-data with the field "file".'],
  },
  {
    slug: 'unprocessable',
    status: 422,
    title: 'The request cannot be processed',
    meaning:
      'The request is well formed but cannot be carried out as asked: a result file with lines that cannot be read (in the all-or-nothing mode), a reference to an instrument, method or profile that does not exist, a used or expired invitation or reset link, or an Idempotency-Key reused with another body. Nothing was stored.',
    remedy: ['Read detail and errors[] (for files, the line and column of each problem).', 'For a new request, use a new Idempotency-Key.'],
    extensions: { errors: 'Where it went wrong, when known.', errors_total: 'For files: how many problems in all.' },
  },
  {
    slug: 'rate-limited',
    status: 429,
    title: 'Too many requests',
    meaning: 'The caller has used its budget of requests for the current window. Each API key has its own budget.',
    remedy: [
      'Wait the number of seconds in the Retry-After header, then retry.',
      'Read the RateLimit and RateLimit-Policy headers on every response to stay within the budget.',
    ],
  },
  {
    slug: 'internal',
    status: 500,
    title: 'Internal server error',
    meaning: 'Something failed on the server’s side. The request may or may not have been stored.',
    remedy: [
      'Retry writes with the same Idempotency-Key: a write that was stored is not done twice.',
      'If it persists, give the request_id to whoever runs the server; it finds the error in the server’s log.',
    ],
  },
  {
    slug: 'response-mismatch',
    status: 500,
    title: 'The response does not match the OpenAPI document',
    meaning: 'Raised only by servers started for testing, which check every response against the API reference.',
    remedy: ['Report it with the request_id and detail: the server or its API reference needs fixing.'],
  },
];

/** "Unsupported Media Type" → "unsupported-media-type": the slug of a problem that carries only an HTTP status. */
export const statusSlug = (status: number) => (STATUS_CODES[status] ?? 'Bad Request').toLowerCase().replace(/[^a-z]+/g, '-');

export function problemTypeDoc(slug: string): ProblemTypeDoc | undefined {
  return PROBLEM_TYPES.find((doc) => doc.slug === slug);
}
