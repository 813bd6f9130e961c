// The curl command equivalent to a call: a logged one (Request log) or one made with the API
// reference's "Try it out". Credentials are never copied (a log's were redacted anyway, a
// console call carries a session cookie): the command reads $MELTWIRE_KEY.
// Structural on purpose (a subset of RequestLogEntry): the unit tests import this file under the
// server's module settings, which the generated client types do not satisfy.
export interface CurlInput {
  method: string;
  path: string;
  query: string;
  request: { headers: Record<string, string>; body: string | null; body_kind: string; content_type: string | null };
}

/** Quotes for a POSIX shell: single quotes, with embedded ones closed, escaped and reopened. */
export function shellQuote(value: string): string {
  return `'${value.replace(/'/g, `'\\''`)}'`;
}

const COPIED_HEADERS: [string, string][] = [
  ['content-type', 'Content-Type'],
  ['accept', 'Accept'],
  ['idempotency-key', 'Idempotency-Key'],
];

function multipartParts(body: string | null): string[] {
  if (!body) return [];
  try {
    const { fields = {}, files = [] } = JSON.parse(body) as {
      fields?: Record<string, unknown>;
      files?: { field: string; name: string; content_type: string }[];
    };
    return [
      ...Object.entries(fields).map(
        ([name, value]) => `-F ${shellQuote(`${name}=${typeof value === 'string' ? value : JSON.stringify(value)}`)}`,
      ),
      ...files.map((file) => `-F ${shellQuote(`${file.field}=@${file.name};type=${file.content_type}`)}`),
    ];
  } catch {
    return [];
  }
}

export function curlCommand(entry: CurlInput, origin: string): string {
  const url = `${origin}${entry.path}${entry.query ? `?${entry.query}` : ''}`;
  const lines = [`curl -sS${entry.method === 'GET' ? '' : ` -X ${entry.method}`} ${shellQuote(url)}`];
  // The caller's credentials become the reader's key; an anonymous call stays anonymous.
  if (entry.request.headers.authorization || entry.request.headers.cookie) lines.push(`-H "Authorization: Bearer $MELTWIRE_KEY"`);
  const multipart = entry.request.body_kind === 'multipart';
  for (const [name, label] of COPIED_HEADERS) {
    const value = entry.request.headers[name];
    // curl writes the multipart Content-Type itself, with the boundary it chooses.
    if (value && !(multipart && name === 'content-type')) lines.push(`-H ${shellQuote(`${label}: ${value}`)}`);
  }
  if (multipart) lines.push(...multipartParts(entry.request.body));
  else if (entry.request.body !== null && entry.request.body_kind !== 'none') lines.push(`--data-raw ${shellQuote(entry.request.body)}`);
  return lines.join(' \\\n  ');
}
