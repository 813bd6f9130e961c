// Requests for one operation: path parameters, query, headers and a body derived from the
// operation's request schema — valid-shaped, mutated with hostile values, or broken outright
// (broken-bodies.ts); uploads get multipart bodies (upload-arbitraries.ts).
import { gzipSync } from 'node:zlib';
import fc from 'fast-check';
import type { FuzzBody, FuzzRequest, Operation, Parameter } from './fuzz-requests.ts';
import { asText, brokenBody, rarely } from './broken-bodies.ts';
import { hostileKey, hostileString, mutation, mutate, PROTOTYPE_NAMES, toJsonText } from './hostile.ts';
import { multipartBody } from './upload-arbitraries.ts';
import { arbitraryFor, type JsonSchema, type Vocabulary } from './schema-arbitrary.ts';

/** Which table a path's {id} names. */
const PATH_TABLES: [RegExp, string][] = [
  [/^\/users\//, 'users'],
  [/^\/api-keys\//, 'api_keys'],
  [/^\/instruments\//, 'instruments'],
  [/^\/methods\//, 'methods'],
  [/^\/samples\//, 'samples'],
  [/^\/import-profiles\//, 'import_profiles'],
  [/^\/imports\//, 'imports'],
  [/^\/reference-materials\//, 'reference_materials'],
  [/^\/standardizations\//, 'standardizations'],
  [/^\/request-log\//, 'request_log'],
];

const badEscapes = fc.constantFrom('%ZZ', '%', '%E0%A4%A', '%C0%AF', '%00', '%FF%FE', '..', '%2e%2e', '%2F');

const hostileSegment = fc.oneof(
  badEscapes,
  fc.constantFrom(...PROTOTYPE_NAMES),
  hostileString.map((s) => encode(s.slice(0, 500))),
);

function pathArbitrary(op: Operation, vocabulary: Vocabulary): fc.Arbitrary<string> {
  const table = PATH_TABLES.find(([pattern]) => pattern.test(op.path))?.[1];
  const names = op.parameters.filter((p) => p.in === 'path').map((p) => p.name);
  const segment = (name: string): fc.Arbitrary<string> => {
    const known = name === 'n' ? ['1', '2', '3', '99'] : (vocabulary.ids[table ?? ''] ?? []);
    return known.length ? fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...known) }, hostileSegment) : hostileSegment;
  };
  return fc
    .tuple(...names.map(segment))
    .map((values) => names.reduce((path, name, i) => path.replace(`{${name}}`, values[i]), `/api/v1${op.path}`));
}

/** Percent-encoded UTF-8; a lone surrogate (which no URL can carry) becomes U+FFFD. */
const encode = (text: string) => encodeURIComponent(Buffer.from(text).toString());
const pair = (key: string, value: string) => `${encode(key)}=${encode(value)}`;

function queryArbitrary(op: Operation, vocabulary: Vocabulary): fc.Arbitrary<string> {
  const params = op.parameters.filter((p) => p.in === 'query');
  const known = params.map((p: Parameter) =>
    fc.option(
      fc.oneof(
        { weight: 3, arbitrary: arbitraryFor(p.schema, vocabulary, p.name).map(asText) },
        hostileString.map((s) => s.slice(0, 2000)),
      ),
      { freq: 2 },
    ),
  );
  const extra = rarely(
    fc.array(
      fc.oneof(
        fc.tuple(hostileKey, hostileString).map(([k, v]) => pair(k, v.slice(0, 200))),
        badEscapes.map((e) => (params.length ? `${params[0].name}=${e}` : `q=${e}`)),
        fc.constantFrom(...PROTOTYPE_NAMES).map((name) => `${name}=1`),
        fc.constant(params.length ? `${params[0].name}=a&${params[0].name}=b` : 'a=1&a=2'),
      ),
      { minLength: 1, maxLength: 2 },
    ),
  );
  return fc.tuple(fc.tuple(...known), extra).map(([values, extras]) => {
    const parts = values.flatMap((v, i) => (v === null ? [] : [pair(params[i].name, v)]));
    const all = [...parts, ...extras];
    return all.length ? `?${all.join('&')}` : '';
  });
}

function jsonBody(schema: JsonSchema, vocabulary: Vocabulary): fc.Arbitrary<FuzzBody> {
  const shaped = arbitraryFor(schema, vocabulary);
  const text = (value: unknown): FuzzBody => ({ kind: 'text', contentType: 'application/json', text: toJsonText(value) });
  return fc.oneof(
    { weight: 4, arbitrary: shaped.map(text) },
    { weight: 5, arbitrary: fc.tuple(shaped, fc.array(mutation, { minLength: 1, maxLength: 3 })).map(([v, m]) => text(mutate(v, m))) },
    {
      weight: 1,
      arbitrary: shaped.map((v) => ({
        kind: 'text' as const,
        contentType: 'application/json',
        text: toJsonText(v),
        encoding: 'gzip',
        bytes: gzipSync(toJsonText(v)),
      })),
    },
    { weight: 2, arbitrary: brokenBody },
  );
}

// Mostly fresh keys; a few shared ones, so that replays and key reuse (409, 422) happen too.
const idempotencyKey = fc.oneof({ weight: 8, arbitrary: fc.uuid() }, fc.constantFrom('k1', 'k2', 'x'.repeat(256)));

export function requestArbitrary(op: Operation, vocabulary: Vocabulary): fc.Arbitrary<FuzzRequest> {
  const body: fc.Arbitrary<FuzzBody | undefined> = op.body
    ? op.body.contentType === 'multipart/form-data'
      ? multipartBody(op.body.schema, vocabulary)
      : jsonBody(op.body.schema, vocabulary)
    : fc.oneof({ weight: 6, arbitrary: fc.constant(undefined) }, brokenBody);
  const write = op.method !== 'get';
  return fc
    .record({
      path: pathArbitrary(op, vocabulary),
      query: queryArbitrary(op, vocabulary),
      key: write ? fc.option(idempotencyKey, { freq: 3 }) : fc.constant(null),
      body,
    })
    .map(({ path, query, key, body }): FuzzRequest => ({
      method: op.method,
      url: `${path}${query}`,
      headers: key === null ? {} : { 'idempotency-key': key },
      ...(body ? { body } : {}),
    }));
}
