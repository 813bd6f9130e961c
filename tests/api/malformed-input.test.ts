// Input the server cannot even read is the client's mistake, answered 4xx with a problem that
// says what is wrong: malformed percent-encoding in the path, a body that is not in its
// Content-Encoding (or in one we do not accept), malformed JSON and malformed multipart.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SCOPES } from '../../server/domain/auth/scopes.ts';
import { createTestApp, expectProblem, issueKey, problemBody, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
let key: string;
let consoleDir: string;

beforeAll(async () => {
  consoleDir = mkdtempSync(join(tmpdir(), 'meltwire-console-'));
  writeFileSync(join(consoleDir, 'index.html'), '<!doctype html><title>console</title>');
  t = await createTestApp({}, { consoleDir });
  key = (await issueKey(t, [...SCOPES])).secret;
});
afterAll(async () => {
  await t.close();
  rmSync(consoleDir, { recursive: true, force: true });
});

const get = (url: string) => request(t.app).get(url).set('authorization', `Bearer ${key}`);
const post = (url: string) => request(t.app).post(url).set('authorization', `Bearer ${key}`);

function expectType(res: request.Response, status: number, type: string) {
  expectProblem(res, status);
  expect(problemBody(res).type).toBe(`/problems/${type}`);
}

describe('malformed percent-encoding', () => {
  it.each(['/api/v1/samples/%ZZ', '/api/v1/samples/abc%', '/api/v1/instruments/%E0%A4%A/drift', '/api/v1/samples/%ZZ/burns/1'])(
    'in an API path: %s → 400 malformed-url',
    async (url) => {
      const res = await get(url);
      expectType(res, 400, 'malformed-url');
      expect(problemBody(res).detail).toContain('%25');
    },
  );

  it('in a console path → 400 malformed-url; the console itself still loads', async () => {
    expectType(await request(t.app).get('/assets/%ZZ'), 400, 'malformed-url');
    expectType(await request(t.app).get('/samples/%E0%A4%A'), 400, 'malformed-url');
    const page = await request(t.app).get('/samples/K24-0412');
    expect(page.status).toBe(200);
    expect(page.text).toContain('<title>console</title>');
  });

  it('in a query string: read leniently, never a 5xx', async () => {
    for (const url of ['/api/v1/samples?heat=%ZZ', '/api/v1/samples.csv?heat=%E0%A4%A', '/api/v1/samples?%ZZ=1&limit=%']) {
      const res = await get(url);
      expect(res.status, `${url}: ${res.text}`).toBeLessThan(500);
    }
  });
});

describe('Content-Encoding', () => {
  const json = (encoding: string, body: string | Buffer) =>
    post('/api/v1/samples')
      .set('content-type', 'application/json')
      .set('content-encoding', encoding)
      .serialize((bytes: unknown) => bytes as string)
      .send(body);

  it.each(['gzip', 'deflate', 'br'])('a body that is not %s although it says so → 400 malformed-body', async (encoding) => {
    const res = await json(encoding, '{"sample_code":"x"}');
    expectType(res, 400, 'malformed-body');
    expect(problemBody(res).title).toBe('Body does not match its Content-Encoding');
  });

  it('a real gzip body is read', async () => {
    const res = await json('gzip', gzipSync('{"sample_code":"x"}'));
    expectType(res, 400, 'validation-failed');
  });

  it.each(['compress', 'zstd', 'gzip, gzip'])('Content-Encoding %s → 415', async (encoding) => {
    const res = await json(encoding, '{}');
    expectType(res, 415, 'unsupported-media-type');
    expect(problemBody(res).title).toBe('Unsupported Content-Encoding');
  });

  it('a charset other than UTF-8 → 415', async () => {
    const res = await post('/api/v1/samples').set('content-type', 'application/json; charset=koi8-r').send('{}');
    expectType(res, 415, 'unsupported-media-type');
  });
});

describe('malformed JSON', () => {
  it.each(['{', '{"a":1}x', '[1,', '"abc"', "{'a':1}"])('%s → 400 malformed-json', async (body) => {
    expectType(await post('/api/v1/samples').set('content-type', 'application/json').send(body), 400, 'malformed-json');
  });
});

describe('malformed multipart', () => {
  const TRUNCATED =
    '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\nSample,Mn\r\nA,1';
  const cases: [string, string, string][] = [
    [
      'another boundary than announced',
      'multipart/form-data; boundary=XYZ',
      '--ABC\r\nContent-Disposition: form-data; name="a"\r\n\r\nb\r\n--ABC--\r\n',
    ],
    ['no boundary', 'multipart/form-data', '--XYZ\r\n\r\n'],
    ['a truncated body', 'multipart/form-data; boundary=XYZ', TRUNCATED],
    ['garbage', 'multipart/form-data; boundary=XYZ', 'garbage'],
  ];
  for (const path of ['/api/v1/imports', '/api/v1/imports/preview']) {
    it.each(cases)(`${path}: %s → 400 malformed-body`, async (_name, contentType, body) => {
      const res = await post(path).set('content-type', contentType).send(body);
      expectType(res, 400, 'malformed-body');
      expect(problemBody(res).title).toBe('Malformed multipart body');
    });
  }

  it('with an Idempotency-Key the key stays free for a correct retry', async () => {
    const first = await post('/api/v1/imports')
      .set('content-type', 'multipart/form-data; boundary=XYZ')
      .set('idempotency-key', 'mp-1')
      .send(TRUNCATED);
    expectType(first, 400, 'malformed-body');
    const retry = await post('/api/v1/imports')
      .set('idempotency-key', 'mp-1')
      .field('instrument_id', 'x')
      .field('method_id', 'y')
      .attach('file', Buffer.from('Sample,Mn\nA,1\n'), 'a.csv');
    expectType(retry, 422, 'unprocessable');
  });
});

describe('the request log', () => {
  it('records each refused call with its status', async () => {
    await get('/api/v1/samples/%ZZ').set('x-request-id', 'malformed-path');
    await post('/api/v1/imports').set('content-type', 'multipart/form-data').set('x-request-id', 'malformed-mp').send('x');
    const log = await get('/api/v1/request-log').query({ limit: 200 });
    const status = (id: string) => log.body.data.find((e: { request_id: string }) => e.request_id === id)?.status;
    expect([status('malformed-path'), status('malformed-mp')]).toEqual([400, 400]);
  });
});
