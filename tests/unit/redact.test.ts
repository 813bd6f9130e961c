import { describe, expect, it } from 'vitest';
import { generateKeySecret } from '../../server/domain/api-keys/key-format.ts';
import { snapshotResponseBody, truncateUtf8 } from '../../server/http/body-snapshot.ts';
import { redactHeaders, redactJson, redactQuery, redactText } from '../../server/domain/request-log/redact.ts';

describe('redaction for the request log', () => {
  const key = generateKeySecret();

  it('blanks secret-named JSON fields at any depth and keys inside any string', () => {
    const { value, redacted } = redactJson({
      email: 'a@kestrelbend.test',
      password: 'hunter22-hunter22',
      nested: [{ client_secret: { any: 'shape' }, refresh_token: 42, note: `key is ${key}` }],
      count: 3,
    });
    expect(redacted).toBe(true);
    expect(value).toEqual({
      email: 'a@kestrelbend.test',
      password: '[redacted]',
      nested: [{ client_secret: '[redacted]', refresh_token: '[redacted]', note: 'key is mw_live_[redacted]' }],
      count: 3,
    });
  });

  it('removes webhook signing secrets from any text', () => {
    const secret = 'whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw';
    expect(redactText(`endpoint secret ${secret}, copied`)).toEqual({ value: 'endpoint secret whsec_[redacted], copied', redacted: true });
    expect(redactJson({ note: secret, previous_secret: secret }).value).toEqual({
      note: 'whsec_[redacted]',
      previous_secret: '[redacted]',
    });
  });

  it('reports nothing removed when there was nothing to remove, and keeps public key prefixes', () => {
    expect(redactJson({ name: 'MES', prefix: 'mw_live_7Qm2xP', token_count: null })).toEqual({
      value: { name: 'MES', prefix: 'mw_live_7Qm2xP', token_count: null },
      redacted: false,
    });
  });

  it('redacts secret pairs in JSON that was cut and cannot be parsed', () => {
    const cut = `{"email":"a@kestrelbend.test","password":"hunter22-hun`;
    expect(redactText(cut).value).toBe('{"email":"a@kestrelbend.test","password":"[redacted]"');
    expect(redactText(`{"secret":"${key.slice(0, 20)}`).value).not.toContain(key.slice(8, 20));
  });

  it('keeps the Authorization scheme, blanks cookies and secret-named headers', () => {
    expect(
      redactHeaders({
        Authorization: `Bearer ${key}`,
        cookie: 'mw_session=abc',
        'set-cookie': ['a=1', 'b=2'],
        'x-api-key': 'x',
        'x-request-id': 'r1',
        'content-length': 12,
      }),
    ).toEqual({
      authorization: 'Bearer [redacted]',
      cookie: '[redacted]',
      'set-cookie': '[redacted]',
      'x-api-key': '[redacted]',
      'x-request-id': 'r1',
      'content-length': '12',
    });
  });

  it('keeps a clean query string byte for byte and redacts secret parameters', () => {
    expect(redactQuery('limit=5&cursor=eyJpZCI6InVzcl8xIn0')).toEqual({ value: 'limit=5&cursor=eyJpZCI6InVzcl8xIn0', redacted: false });
    expect(redactQuery('token=abc&limit=5')).toEqual({ value: 'token=%5Bredacted%5D&limit=5', redacted: true });
  });
});

describe('truncateUtf8', () => {
  // Byte lengths from RFC 3629 §3: U+00C4 (Ä) is 2 bytes, U+20AC (€) 3 bytes, U+1F525 4 bytes.
  it('cuts at the byte limit without splitting a character', () => {
    expect(truncateUtf8('ÄÄÄ', 5)).toEqual({ text: 'ÄÄ', truncated: true });
    expect(truncateUtf8('€€', 4)).toEqual({ text: '€', truncated: true });
    expect(truncateUtf8('a\u{1F525}', 4)).toEqual({ text: 'a', truncated: true });
    expect(truncateUtf8('ÄÄ', 4)).toEqual({ text: 'ÄÄ', truncated: false });
  });
});

describe('snapshotResponseBody of a JSON answer far above the limit', () => {
  it('redacts its first bytes as text and cuts it, without parsing the whole answer', () => {
    const key = generateKeySecret();
    const rows = Array.from({ length: 2000 }, (_, i) => ({ id: `smp_${i}`, note: i === 1 ? key : 'x'.repeat(20) }));
    const text = JSON.stringify({ secret: 'whsec_c2VjcmV0LXZhbHVlLWJhc2U2NA==', data: rows });
    const body = Buffer.from(text);
    const snapshot = snapshotResponseBody('application/json', { body, size: body.length, complete: true }, 16384);
    expect(snapshot).toMatchObject({ kind: 'json', size: body.length, truncated: true, redacted: true });
    expect(Buffer.byteLength(snapshot.body!)).toBeLessThanOrEqual(16384);
    expect(snapshot.body!.startsWith('{"secret":"[redacted]","data":[{"id":"smp_0"')).toBe(true);
    expect(snapshot.body).not.toContain(key);
  });
});

describe('snapshotResponseBody of a JSON answer of a few KB', () => {
  it('keeps the same text the parsed path would, and still redacts secret-named fields and key shapes', () => {
    const rows = Array.from({ length: 60 }, (_, i) => ({ id: `smp_${i}`, mean: i / 7, flags: ['x'], note: 'µ ≤ 100 %' }));
    const text = JSON.stringify({ data: rows, next_cursor: null });
    const body = Buffer.from(text);
    expect(body.length).toBeGreaterThan(4096);
    expect(snapshotResponseBody('application/json', { body, size: body.length, complete: true }, 16384)).toMatchObject({
      body: JSON.stringify(JSON.parse(text)),
      truncated: false,
      redacted: false,
    });
    const withSecret = Buffer.from(JSON.stringify({ data: rows, token: 'abc', key: generateKeySecret() }));
    const snapshot = snapshotResponseBody('application/json', { body: withSecret, size: withSecret.length, complete: true }, 16384);
    expect(snapshot.redacted).toBe(true);
    expect(JSON.parse(snapshot.body!)).toMatchObject({ token: '[redacted]', key: expect.stringMatching(/\[redacted\]$/) });
  });
});
