// The hostile requests of issue 17, sent to every operation they apply to before the generated
// ones: malformed percent-encoding in the path and the query, JSON nested 10,000 deep (with and
// without Idempotency-Key), prototype names as keys, malformed JSON, a false or unsupported
// Content-Encoding, and malformed multipart.
import type { FuzzBody, FuzzRequest, Operation } from './fuzz-requests.ts';
import { nestedArrays, nestedObjects, PROTOTYPE_NAMES, toJsonText } from './hostile.ts';
import type { Vocabulary } from './schema-arbitrary.ts';

const json = (text: string, encoding?: string): FuzzBody => ({
  kind: 'text',
  contentType: 'application/json',
  text,
  ...(encoding ? { encoding } : {}),
});

const multipart = (contentType: string, text: string): FuzzBody => ({ kind: 'text', contentType, text });

const TRUNCATED_PART =
  '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\nSample,Mn\r\nA,1';

function prototypeBodies(): FuzzBody[] {
  return PROTOTYPE_NAMES.flatMap((name) => [
    json(toJsonText({ [name]: 'x' })),
    json(toJsonText({ [name]: { polluted: true } })),
    json(toJsonText({ fields: { [name]: 'x' }, burns: [{ values: { [name]: 1 } }] })),
  ]);
}

/** Valid requests that store prototype names as data, so the reads after them meet such data. */
function storingPrototypeNames(op: Operation, vocabulary: Vocabulary): FuzzBody[] {
  const instrument_id = vocabulary.ids.instruments[0];
  const method_id = vocabulary.ids.methods[0];
  const sample = (name: string) => ({
    sample_code: `FUZZ-${name}`,
    instrument_id,
    method_id,
    fields: { [name]: 'x', furnace: 'EAF-1' },
    burns: [{ values: { Mn: 0.71, C: '<0.002' } }],
  });
  const names = PROTOTYPE_NAMES.filter((name) => name !== '__proto__');
  const csv = `Sample,Heat,${names.join(',')},Mn %\nFUZZ-CSV,H1,${names.map((n) => `v-${n}`).join(',')},0.70\nFUZZ-CSV,H1,,,,,0.72\n`;
  const file = { name: 'prototype-columns.csv', content: Buffer.from(csv) };
  switch (op.operationId) {
    case 'pushSample':
      return names.map((name) => json(toJsonText(sample(name))));
    case 'pushSampleBatch':
      return [json(toJsonText({ samples: names.map(sample) }))];
    case 'uploadImport':
    case 'previewImport':
      return [
        {
          kind: 'multipart',
          fields: [
            ['instrument_id', instrument_id],
            ['method_id', method_id],
          ],
          file,
        },
      ];
    case 'createImportProfile':
      return [json(toJsonText({ name: 'fuzz profile', columns: { fields: { constructor: 'Furnace', tostring: 'Ladle' } } }))];
    default:
      return [];
  }
}

export function fixedExamples(op: Operation, vocabulary: Vocabulary): FuzzRequest[] {
  const pathParams = op.parameters.filter((p) => p.in === 'path').map((p) => p.name);
  const someId = (name: string) => (name === 'n' ? '1' : (Object.values(vocabulary.ids).flat()[0] ?? 'x'));
  const path = (value?: string) => pathParams.reduce((p, name) => p.replace(`{${name}}`, value ?? someId(name)), `/api/v1${op.path}`);
  const base = path();
  const examples: FuzzRequest[] = [];
  const add = (url: string, body?: FuzzBody, headers: Record<string, string> = {}) =>
    examples.push({ method: op.method, url, headers, ...(body ? { body } : {}) });

  for (const bad of ['%ZZ', '%', 'abc%', '%E0%A4%A']) if (pathParams.length) add(path(bad));
  const query = op.parameters.find((p) => p.in === 'query')?.name ?? 'q';
  for (const bad of ['%ZZ', '%', '%E0%A4%A']) add(`${base}?${query}=${bad}`);
  add(`${base}?__proto__=x&constructor=y&toString=z`);

  const deep = [nestedArrays(10_000).text, nestedObjects(10_000).text, nestedArrays(65).text];
  for (const text of deep) {
    add(base, json(text));
    if (op.method !== 'get') add(base, json(text), { 'idempotency-key': `deep-${text.length}` });
  }
  for (const body of [...storingPrototypeNames(op, vocabulary), ...prototypeBodies()]) add(base, body);
  for (const text of ['{', '{"a":1}x', '"abc"', '[1,']) add(base, json(text));
  for (const encoding of ['gzip', 'deflate', 'br', 'compress', 'zstd']) add(base, json('{"a":1}', encoding));
  add(base, { kind: 'text', contentType: 'application/json; charset=koi8-r', text: '{}' });
  if (op.body?.contentType === 'multipart/form-data') {
    add(base, multipart('multipart/form-data; boundary=XYZ', '--ABC\r\nContent-Disposition: form-data; name="a"\r\n\r\nb\r\n--ABC--\r\n'));
    add(base, multipart('multipart/form-data', 'no boundary'));
    add(base, multipart('multipart/form-data; boundary=XYZ', TRUNCATED_PART));
    add(base, multipart('multipart/form-data; boundary=XYZ', 'garbage'));
    add(base, multipart('multipart/form-data; boundary=XYZ', TRUNCATED_PART), { 'idempotency-key': 'truncated-part' });
  }
  return examples;
}
