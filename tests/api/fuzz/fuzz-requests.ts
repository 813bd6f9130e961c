// The operations of openapi/openapi.json as the fuzz suites see them, the requests they send
// (plain data, so a failure can print exactly what was sent) and how they are sent (supertest).
import { readFileSync } from 'node:fs';
import request from 'supertest';
import { OPENAPI_FILE } from '../../../server/openapi/write.ts';
import type { FuzzApp } from './fuzz-app.ts';
import type { JsonSchema } from './schema-arbitrary.ts';

export interface Parameter {
  in: 'path' | 'query' | 'header';
  name: string;
  required?: boolean;
  schema: JsonSchema;
}

export interface Operation {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  operationId: string;
  parameters: Parameter[];
  body?: { contentType: string; schema: JsonSchema };
}

interface Document {
  paths: Record<
    string,
    Record<string, { operationId: string; parameters?: Parameter[]; requestBody?: { content: Record<string, { schema: JsonSchema }> } }>
  >;
  components: { schemas: Record<string, JsonSchema> };
}

export const document = JSON.parse(readFileSync(OPENAPI_FILE, 'utf8')) as Document;

/** Every operation; logout last, since it is the one meant to end a session. */
export const operations: Operation[] = Object.entries(document.paths)
  .flatMap(([path, methods]) =>
    Object.entries(methods).map(([method, op]) => {
      const [contentType, media] = Object.entries(op.requestBody?.content ?? {})[0] ?? [];
      return {
        method: method as Operation['method'],
        path,
        operationId: op.operationId,
        parameters: op.parameters ?? [],
        ...(contentType ? { body: { contentType, schema: media.schema } } : {}),
      };
    }),
  )
  .sort((a, b) => Number(a.operationId === 'logout') - Number(b.operationId === 'logout'));

export type FuzzBody =
  /** Text sent as is with this content type (JSON, broken JSON, other types), maybe compressed. */
  | { kind: 'text'; contentType: string; text: string; encoding?: string; bytes?: Buffer }
  | { kind: 'multipart'; fields: [string, string][]; file?: { name: string; content: Buffer } };

export interface FuzzRequest {
  method: Operation['method'];
  /** Path below the server root with the query string, exactly as sent. */
  url: string;
  headers: Record<string, string>;
  body?: FuzzBody;
}

const clip = (text: string, max = 300) => (text.length > max ? `${text.slice(0, max)}… (${text.length} characters)` : text);

/** The request in a form a failing test can print. */
export function describeRequest(r: FuzzRequest): string {
  const lines = [`${r.method.toUpperCase()} ${clip(r.url)}`, ...Object.entries(r.headers).map(([k, v]) => `${k}: ${clip(v, 100)}`)];
  if (r.body?.kind === 'text') {
    lines.push(`content-type: ${r.body.contentType}`);
    if (r.body.encoding) lines.push(`content-encoding: ${r.body.encoding}${r.body.bytes ? ' (encoded)' : ' (but sent as is)'}`);
    lines.push(clip(r.body.text));
  }
  if (r.body?.kind === 'multipart') {
    for (const [name, value] of r.body.fields) lines.push(`field ${JSON.stringify(clip(name, 60))} = ${JSON.stringify(clip(value, 100))}`);
    if (r.body.file)
      lines.push(`file ${JSON.stringify(r.body.file.name)}: ${JSON.stringify(clip(r.body.file.content.toString('latin1')))}`);
  }
  return lines.join('\n');
}

export async function send(app: FuzzApp, r: FuzzRequest): Promise<request.Response> {
  let test = request(app.server)[r.method](r.url).set('authorization', app.authorization);
  for (const [name, value] of Object.entries(r.headers)) test = test.set(name, value);
  const body = r.body;
  if (body?.kind === 'text') {
    test = test.set('content-type', body.contentType);
    if (body.encoding) test = test.set('content-encoding', body.encoding);
    // Bytes as they are: superagent would otherwise JSON-encode a Buffer sent as application/json.
    return body.bytes ? test.serialize((bytes: unknown) => bytes as string).send(body.bytes) : test.send(body.text);
  }
  if (body?.kind === 'multipart') {
    for (const [name, value] of body.fields) test = test.field(name, value);
    if (body.file) test = test.attach('file', body.file.content, body.file.name);
  }
  return test;
}

/** A failure worth reporting: any answer of 500 or more. */
export function serverError(res: request.Response): string | undefined {
  if (res.status < 500) return undefined;
  return `${res.status} ${clip(res.text, 400)}`;
}
