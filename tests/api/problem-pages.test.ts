// Every problem `type` the server can answer with opens a page that explains it. The slugs are
// found in the server's code, so a new problem type without a page fails here.
import { STATUS_CODES } from 'node:http';
import { readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PROBLEM_TYPES, statusSlug } from '../../server/lib/problem-types.ts';
import { createTestApp, expectProblem, type TestApp } from '../helpers/test-app.ts';

const SERVER = resolve(import.meta.dirname, '../../server');

function serverFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
    entry.isDirectory() ? serverFiles(join(dir, entry.name)) : entry.name.endsWith('.ts') ? [join(dir, entry.name)] : [],
  );
}

/** Slugs given to ProblemError, directly or through a subclass's super(status, slug, …). */
function slugsInCode(): string[] {
  const slugs = new Set<string>();
  for (const file of serverFiles(SERVER)) {
    for (const match of readFileSync(file, 'utf8').matchAll(/(?:super|new ProblemError)\(\s*\d{3},\s*'([a-z-]+)'/g)) slugs.add(match[1]);
  }
  return [...slugs].sort();
}

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('problem type pages', () => {
  it('finds the problem types in the code (the scan works)', () => {
    expect(slugsInCode()).toEqual(expect.arrayContaining(['validation-failed', 'forbidden', 'unstorable-value', 'response-mismatch']));
  });

  it.each(slugsInCode())('/problems/%s explains the type in its own entry', async (slug) => {
    const doc = PROBLEM_TYPES.find((entry) => entry.slug === slug);
    expect(doc, `add ${slug} to server/lib/problem-types.ts`).toBeDefined();
    const res = await request(t.app).get(`/problems/${slug}`).set('accept', 'text/html');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.text).toContain(`<code>/problems/${slug}</code>`);
    expect(res.text).toContain('What it means');
    expect(res.text).toContain('What to do');
  });

  it('has a page for every 4xx status Express may pass on, from its status', async () => {
    for (const status of Object.keys(STATUS_CODES)
      .map(Number)
      .filter((s) => s >= 400 && s < 500)) {
      const res = await request(t.app)
        .get(`/problems/${statusSlug(status)}`)
        .set('accept', 'text/html');
      expect(res.status, statusSlug(status)).toBe(200);
      expect(res.text).toContain(`<span class="status">${status}</span>`);
    }
  });

  it('resolves the type of a real problem, and answers JSON when asked', async () => {
    const problem = await request(t.app).get('/api/v1/users');
    expectProblem(problem, 401);
    const page = await request(t.app).get(new URL(problem.body.type, 'http://meltwire.test/api/v1/users').pathname);
    expect(page.status).toBe(200);
    expect(page.text).toContain('Authentication required');

    const json = await request(t.app).get('/problems/forbidden').set('accept', 'application/json');
    expect(json.headers['content-type']).toMatch(/^application\/json/);
    expect(json.body).toMatchObject({
      type: '/problems/forbidden',
      status: 403,
      title: 'Not allowed',
      extensions: { required_scope: expect.any(String) },
    });
  });

  it('lists every type on /problems and answers an unknown one with 404', async () => {
    const index = await request(t.app).get('/problems').set('accept', 'text/html');
    for (const doc of PROBLEM_TYPES) expect(index.text).toContain(`href="/problems/${doc.slug}"`);
    expectProblem(await request(t.app).get('/problems/no-such-type'), 404);
  });
});
