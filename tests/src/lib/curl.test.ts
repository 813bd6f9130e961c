import { describe, expect, it } from 'vitest';
import { curlCommand, shellQuote } from '../../../src/lib/curl.ts';

const noBody = { headers: {}, body: null, body_kind: 'none' as const, content_type: null };

describe('curlCommand', () => {
  it('writes a GET with its query and the key from the environment, never a logged credential', () => {
    const command = curlCommand(
      {
        method: 'GET',
        path: '/api/v1/samples',
        query: 'limit=5',
        request: { ...noBody, headers: { authorization: 'Bearer [redacted]', accept: 'application/json' } },
      },
      'https://lab.kestrelbend.test',
    );
    expect(command).toBe(
      `curl -sS 'https://lab.kestrelbend.test/api/v1/samples?limit=5' \\\n  -H "Authorization: Bearer $MELTWIRE_KEY" \\\n  -H 'Accept: application/json'`,
    );
  });

  it('sends a JSON body, its type and Idempotency-Key', () => {
    const command = curlCommand(
      {
        method: 'POST',
        path: '/api/v1/users',
        query: '',
        request: {
          headers: { cookie: '[redacted]', 'content-type': 'application/json', 'idempotency-key': 'k-1' },
          body: `{"name":"O'Neil"}`,
          body_kind: 'json',
          content_type: 'application/json',
        },
      },
      'http://localhost:3000',
    );
    expect(command).toContain(`curl -sS -X POST 'http://localhost:3000/api/v1/users'`);
    expect(command).toContain('Authorization: Bearer $MELTWIRE_KEY');
    expect(command).toContain(`-H 'Idempotency-Key: k-1'`);
    expect(command).toContain(`--data-raw '{"name":"O'\\''Neil"}'`);
  });

  it('leaves an anonymous call anonymous', () => {
    const command = curlCommand(
      {
        method: 'POST',
        path: '/api/v1/auth/password-reset',
        query: '',
        request: {
          headers: { 'content-type': 'application/json' },
          body: '{"email":"a@kestrelbend.test"}',
          body_kind: 'json',
          content_type: 'application/json',
        },
      },
      'http://localhost:3000',
    );
    expect(command).not.toContain('Authorization');
  });

  it('rebuilds a multipart upload as -F parts and lets curl choose the boundary', () => {
    const body = JSON.stringify({
      fields: { instrument: 'OES-1' },
      files: [{ field: 'file', name: 'K24-0412.csv', size: 30, content_type: 'text/csv' }],
    });
    const command = curlCommand(
      {
        method: 'POST',
        path: '/api/v1/imports',
        query: '',
        request: {
          headers: { 'content-type': 'multipart/form-data; boundary=x' },
          body,
          body_kind: 'multipart',
          content_type: 'multipart/form-data; boundary=x',
        },
      },
      'http://localhost:3000',
    );
    expect(command).toContain(`-F 'instrument=OES-1'`);
    expect(command).toContain(`-F 'file=@K24-0412.csv;type=text/csv'`);
    expect(command).not.toContain('boundary');
  });

  it('quotes for a POSIX shell: nothing expands inside single quotes, a quote is closed, escaped and reopened', () => {
    // POSIX.1-2017 XCU 2.2.3: single quotes preserve every character; a single quote cannot occur inside them.
    expect(shellQuote('it\'s "$HOME" `date`')).toBe(`'it'\\''s "$HOME" \`date\`'`);
  });
});
