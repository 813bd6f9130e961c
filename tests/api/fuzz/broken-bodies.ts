// Bodies no server should read as meant: malformed JSON, a Content-Encoding the bytes do not
// have (or one nobody supports), odd content types and charsets, malformed multipart.
import fc from 'fast-check';
import type { FuzzBody } from './fuzz-requests.ts';
import { nestedArrays } from './hostile.ts';

/** Extra junk in one request of four: the rest show how well-formed requests fare. */
export function rarely<T>(junk: fc.Arbitrary<T[]>): fc.Arbitrary<T[]> {
  return fc.oneof({ weight: 3, arbitrary: fc.constant<T[]>([]) }, junk);
}

/** A generated value as a form field or query value. */
export const asText = (value: unknown) => (typeof value === 'string' ? value : (JSON.stringify(value) ?? ''));

const BROKEN_JSON = ['{', '[1,', '"abc"', 'nul', '{"a":1}x', '\u0000', '{"a":1,}', "{'a':1}", '{"a":"\\uZZZZ"}', nestedArrays(12_000).text];

export const brokenBody: fc.Arbitrary<FuzzBody> = fc.oneof(
  fc.constantFrom(...BROKEN_JSON).map((text) => ({ kind: 'text' as const, contentType: 'application/json', text })),
  fc.constantFrom('gzip', 'deflate', 'br', 'compress', 'zstd', 'gzip, gzip', 'identity').map((encoding) => ({
    kind: 'text' as const,
    contentType: 'application/json',
    text: '{"a":1}',
    encoding,
  })),
  fc
    .constantFrom(
      'application/json; charset=koi8-r',
      'application/json; charset=utf-16',
      'text/plain',
      'application/xml',
      'application/x-www-form-urlencoded',
    )
    .map((contentType) => ({ kind: 'text' as const, contentType, text: '{"a":1}' })),
  fc.constantFrom('multipart/form-data; boundary=XYZ', 'multipart/form-data', 'multipart/form-data; boundary=').chain((contentType) =>
    fc
      .constantFrom(
        'garbage',
        '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\nSample,Mn\r\nA,1',
        '--ABC--\r\n',
      )
      .map((text) => ({
        kind: 'text' as const,
        contentType,
        text,
      })),
  ),
);
