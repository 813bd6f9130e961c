// Response conventions: an ETag on every JSON GET (single resources and list pages), If-None-Match
// answered with 304 and no body until the resource changes; gzip or br above 1 KB when the client
// accepts it, the same JSON once decoded; small answers sent as they are; the request log keeps the
// uncompressed body.
import { once } from 'node:events';
import { get, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import { gunzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../server/seed/demo-lab.ts';
import { createTestApp, issueKey, seedDemoLab, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let key: string;
const bearer = () => ({ authorization: `Bearer ${key}` });

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  key = (await issueKey(t, ['samples:read', 'samples:write', 'request-log:read'])).secret;
  for (let i = 1; i <= 5; i++) {
    const res = await request(t.app)
      .post('/api/v1/samples')
      .set(bearer())
      .send({
        sample_code: `HC-${i}`,
        instrument_id: lab.foundry.id,
        method_id: lab.feMethod.id,
        // Three burns, so one can be excluded (the method keeps at least two included).
        burns: [
          { values: { C: 0.2, Mn: 0.7, Si: 0.25 } },
          { values: { C: 0.21, Mn: 0.71, Si: 0.26 } },
          { values: { C: 0.2, Mn: 0.7, Si: 0.26 } },
        ],
      });
    expect(res.status).toBe(201);
  }
});
afterAll(() => t.close());

/** The raw bytes of a response over node:http, as sent (supertest would decode them). */
async function rawGet(path: string, headers: Record<string, string>) {
  const server = t.app.listen(0, '127.0.0.1');
  await once(server, 'listening');
  try {
    const { port } = server.address() as AddressInfo;
    return await new Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }>((done, fail) => {
      get({ host: '127.0.0.1', port, path, headers: { ...bearer(), ...headers } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done({ status: res.statusCode!, headers: res.headers, body: Buffer.concat(chunks) }));
      }).on('error', fail);
    });
  } finally {
    server.close();
  }
}

describe('ETag and If-None-Match', () => {
  it.each(['/api/v1/samples?limit=100', '/api/v1/instruments'])('%s: 304 with no body for the same ETag', async (path) => {
    const first = await request(t.app).get(path).set(bearer());
    expect(first.status).toBe(200);
    const etag = first.headers.etag;
    expect(etag).toMatch(/^W\/".+"$/);
    const again = await request(t.app).get(path).set(bearer()).set('if-none-match', etag);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
  });

  it('a single sample gets a new ETag when it changes', async () => {
    const [sample] = (await request(t.app).get('/api/v1/samples?limit=1').set(bearer())).body.data;
    const first = await request(t.app).get(`/api/v1/samples/${sample.id}`).set(bearer());
    const excluded = await request(t.app)
      .patch(`/api/v1/samples/${sample.id}/burns/2`)
      .set(bearer())
      .send({ excluded: true, reason: 'cracked surface' });
    expect(excluded.status).toBe(200);
    const after = await request(t.app).get(`/api/v1/samples/${sample.id}`).set(bearer()).set('if-none-match', first.headers.etag);
    expect(after.status).toBe(200);
    expect(after.headers.etag).not.toBe(first.headers.etag);
  });
});

describe('compression', () => {
  it('sends a list page gzip-compressed when accepted: the same JSON once decoded', async () => {
    const plain = await rawGet('/api/v1/samples?limit=100', { 'accept-encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    const gzipped = await rawGet('/api/v1/samples?limit=100', { 'accept-encoding': 'gzip' });
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    expect(gzipped.headers.vary).toMatch(/accept-encoding/i);
    const decoded = gunzipSync(gzipped.body);
    expect(decoded.length).toBeGreaterThan(gzipped.body.length);
    expect(JSON.parse(decoded.toString('utf8'))).toEqual(JSON.parse(plain.body.toString('utf8')));
  });

  it('uses br when the client prefers it, and leaves small answers as they are', async () => {
    expect((await rawGet('/api/v1/samples?limit=100', { 'accept-encoding': 'br' })).headers['content-encoding']).toBe('br');
    expect((await rawGet('/api/v1/auth/me', { 'accept-encoding': 'gzip' })).headers['content-encoding']).toBeUndefined();
  });

  it('compresses the CSV export too', async () => {
    const csv = await rawGet('/api/v1/samples.csv', { 'accept-encoding': 'gzip' });
    expect(csv.status).toBe(200);
    expect(csv.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(csv.body).toString('utf8')).toMatch(/HC-1/);
  });

  it('keeps the uncompressed body in the request log', async () => {
    const gzipped = await rawGet('/api/v1/samples?limit=100', { 'accept-encoding': 'gzip' });
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    const requestId = String(gzipped.headers['x-request-id']);
    const entries = (await request(t.app).get('/api/v1/request-log?limit=20').set(bearer())).body.data as {
      id: string;
      request_id: string;
    }[];
    const entry = entries.find((e) => e.request_id === requestId)!;
    const detail = await request(t.app).get(`/api/v1/request-log/${entry.id}`).set(bearer());
    expect(detail.body.response.body).toMatch(/^\{"data":\[/);
  });
});
