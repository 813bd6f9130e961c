import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getImportProfile } from '../../server/domain/imports/import-profiles.service.ts';
import { parseResultFile } from '../../server/domain/imports/parse/index.ts';
import { createTestApp, expectProblem, issueKey, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

// The profile that reads tests/fixtures/imports/quirks-long.csv.
const LONG_PROFILE = JSON.parse(readFileSync(resolve(import.meta.dirname, '../fixtures/imports/quirks-long.profile.json'), 'utf8'));

describe('POST /api/v1/import-profiles', () => {
  it('creates a profile with defaults for everything but the name', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    const res = await agent.post('/api/v1/import-profiles').send({ name: 'Detect everything' });
    expect(res.status).toBe(201);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.headers.location).toBe(`/api/v1/import-profiles/${res.body.id}`);
    expect(res.body).toEqual({
      id: expect.stringMatching(/^ipr_/),
      name: 'Detect everything',
      description: null,
      delimiter: 'auto',
      decimal_separator: 'auto',
      encoding: 'auto',
      header_row: 1,
      layout: 'wide',
      columns: {},
      long_columns: null,
      element_columns: [],
      default_unit: null,
      ignore_columns: [],
      keep_columns: [],
      time: { format: 'auto', time_zone: null, utc_offset: null },
      revision: 1,
      created_at: expect.any(String),
      updated_at: res.body.created_at,
    });
    const fetched = await agent.get(res.headers.location);
    expect(fetched.status).toBe(200);
    expect(fetched.body).toEqual(res.body);
  });

  it('stores element symbols and units in canonical form', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    const res = await agent.post('/api/v1/import-profiles').send({
      name: 'Canonical forms',
      element_columns: [
        { header: 'Mn (line 2)', element: 'MN', unit: 'mg/kg' },
        { header: 'B*', element: 'b', unit: 'µg/kg' },
      ],
      default_unit: 'wt%',
    });
    expect(res.status).toBe(201);
    expect(res.body.element_columns).toEqual([
      { header: 'Mn (line 2)', element: 'Mn', unit: 'ppm' },
      { header: 'B*', element: 'B', unit: 'ppb' },
    ]);
    expect(res.body.default_unit).toBe('%');
  });

  it('answers 400 with errors[] naming each invalid field', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    const cases: [Record<string, unknown>, string[]][] = [
      [{}, ['body.name']],
      [{ name: 'x', delimeter: ';' }, ['body']],
      [{ name: 'x', delimiter: '|', header_row: 0, encoding: 'utf-16' }, ['body.delimiter', 'body.encoding', 'body.header_row']],
      [{ name: 'x', layout: 'long' }, ['body.long_columns']],
      [{ name: 'x', long_columns: { element: 'E', value: 'V' } }, ['body.long_columns']],
      [
        { name: 'x', layout: 'long', long_columns: { element: 'E', value: 'V' }, element_columns: [{ header: 'Mn1', element: 'Mn' }] },
        ['body.element_columns'],
      ],
      [{ name: 'x', element_columns: [{ header: 'A', element: 'Xx' }] }, ['body.element_columns.0.element']],
      [
        {
          name: 'x',
          element_columns: [
            { header: 'A', element: 'Mn' },
            { header: 'B', element: 'mn' },
          ],
        },
        ['body.element_columns.1.element'],
      ],
      [{ name: 'x', default_unit: 'mol%' }, ['body.default_unit']],
      [{ name: 'x', columns: { sample_code: 'Sample', heat: ' sample ' } }, ['body.columns.heat']],
      [{ name: 'x', columns: { sample_code: 'Sample' }, ignore_columns: ['SAMPLE'] }, ['body.ignore_columns.0']],
      [
        { name: 'x', columns: { fields: { 'Bad Key': 'Furnace', heat: 'Heat' } } },
        ['body.columns.fields.Bad Key', 'body.columns.fields.heat'],
      ],
      [{ name: 'x', delimiter: ',', decimal_separator: ',' }, ['body.decimal_separator']],
      [{ name: 'x', time: { format: 'MM/DD/YYYY', utc_offset: '+25:00' } }, ['body.time.format', 'body.time.utc_offset']],
    ];
    for (const [body, locations] of cases) {
      const res = await agent.post('/api/v1/import-profiles').send(body);
      expectProblem(res, 400);
      expect(
        problemBody(res)
          .errors?.map((e) => e.location)
          .sort(),
        JSON.stringify(body),
      ).toEqual(locations);
    }
  });

  it('answers 409 for a name already taken, ignoring case', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    expect((await agent.post('/api/v1/import-profiles').send({ name: 'Cast house OES-2' })).status).toBe(201);
    const res = await agent.post('/api/v1/import-profiles').send({ name: ' cast HOUSE oes-2 ' });
    expectProblem(res, 409);
    expect(problemBody(res).detail).toContain('already exists');
  });

  it('records the creation in the audit trail', async () => {
    const { agent: analyst, user } = await signedInAgent(t, 'analyst');
    const created = await analyst.post('/api/v1/import-profiles').send(LONG_PROFILE);
    expect(created.status).toBe(201);
    const { agent: admin } = await signedInAgent(t, 'admin');
    const audit = await admin.get('/api/v1/audit-events').query({ action: 'import_profile.created', target_id: created.body.id });
    expect(audit.body.data).toHaveLength(1);
    expect(audit.body.data[0]).toMatchObject({
      actor: { type: 'user', id: user.id },
      target: { type: 'import_profile', id: created.body.id },
      before: null,
      after: created.body,
    });
  });
});

describe('PATCH /api/v1/import-profiles/{id}', () => {
  it('merges the change, validates the whole profile, bumps the revision and audits before/after', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    const created = (await agent.post('/api/v1/import-profiles').send({ ...LONG_PROFILE, name: 'To change' })).body;
    const res = await agent.patch(`/api/v1/import-profiles/${created.id}`).send({ header_row: 1, time: { format: 'iso8601' } });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      ...created,
      header_row: 1,
      time: { format: 'iso8601', time_zone: null, utc_offset: null },
      revision: 2,
      updated_at: expect.any(String),
    });

    const { agent: admin } = await signedInAgent(t, 'admin');
    const audit = await admin.get('/api/v1/audit-events').query({ action: 'import_profile.updated', target_id: created.id });
    expect(audit.body.data).toHaveLength(1);
    expect(audit.body.data[0]).toMatchObject({ before: { header_row: 3, revision: 1 }, after: { header_row: 1, revision: 2 } });
  });

  it('refuses a change that leaves the profile invalid, naming the field, and changes nothing', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    const created = (await agent.post('/api/v1/import-profiles').send({ ...LONG_PROFILE, name: 'Stays long' })).body;
    const res = await agent.patch(`/api/v1/import-profiles/${created.id}`).send({ long_columns: null });
    expectProblem(res, 400);
    expect(problemBody(res).errors).toEqual([
      { location: 'body.long_columns', message: expect.stringContaining('long layout'), code: 'custom' },
    ]);
    expect((await agent.get(`/api/v1/import-profiles/${created.id}`)).body).toEqual(created);
    // Switching layout together with its columns is fine.
    const wide = await agent.patch(`/api/v1/import-profiles/${created.id}`).send({ layout: 'wide', long_columns: null });
    expect(wide.status).toBe(200);
    expect(wide.body).toMatchObject({ layout: 'wide', long_columns: null });
  });

  it('answers 400 for an empty change, 404 for an unknown profile and 409 for a taken name', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    const a = (await agent.post('/api/v1/import-profiles').send({ name: 'Profile A' })).body;
    await agent.post('/api/v1/import-profiles').send({ name: 'Profile B' });
    expectProblem(await agent.patch(`/api/v1/import-profiles/${a.id}`).send({}), 400);
    expectProblem(await agent.patch('/api/v1/import-profiles/ipr_nothing').send({ name: 'x' }), 404);
    expectProblem(await agent.get('/api/v1/import-profiles/ipr_nothing'), 404);
    expectProblem(await agent.patch(`/api/v1/import-profiles/${a.id}`).send({ name: 'profile b' }), 409);
    expect((await agent.patch(`/api/v1/import-profiles/${a.id}`).send({ name: 'PROFILE A' })).status).toBe(200);
  });
});

describe('GET /api/v1/import-profiles', () => {
  it('pages through every profile in a stable order', async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    const seen: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await agent.get('/api/v1/import-profiles').query({ limit: 2, ...(cursor ? { cursor } : {}) });
      expect(page.status).toBe(200);
      seen.push(...page.body.data.map((p: { id: string }) => p.id));
      cursor = page.body.next_cursor ?? undefined;
    } while (cursor);
    const all = await t.db('import_profiles').orderBy('id').pluck('id');
    expect(seen).toEqual(all);
    expect(all.length).toBeGreaterThan(3);
  });
});

describe('scopes', () => {
  it('reading needs samples:read; creating and changing need imports:write', async () => {
    const { agent: viewer } = await signedInAgent(t, 'viewer');
    expect((await viewer.get('/api/v1/import-profiles')).status).toBe(200);
    const denied = await viewer.post('/api/v1/import-profiles').send({ name: 'Viewer profile' });
    expectProblem(denied, 403);
    expect(problemBody(denied).required_scope).toBe('imports:write');

    const readOnly = await issueKey(t, ['samples:read']);
    expectProblem(
      await request(t.app).post('/api/v1/import-profiles').set('authorization', `Bearer ${readOnly.secret}`).send({ name: 'Key profile' }),
      403,
    );
    const writer = await issueKey(t, ['imports:write']);
    const created = await request(t.app)
      .post('/api/v1/import-profiles')
      .set('authorization', `Bearer ${writer.secret}`)
      .send({ name: 'Key profile' });
    expect(created.status).toBe(201);
    expectProblem(await request(t.app).get(created.headers.location).set('authorization', `Bearer ${writer.secret}`), 403);
  });
});

describe('a stored profile drives the parser', () => {
  it('the profile as served by the API is accepted by parseResultFile', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    const created = (await agent.post('/api/v1/import-profiles').send({ ...LONG_PROFILE, name: 'Parser input' })).body;
    // Typed: the stored profile as the service returns it is the parser's option.
    const profile = await getImportProfile(t.ctx, created.id);
    expect(profile).toEqual(created);
    const file = [
      'preamble',
      '',
      'Specimen Ref\tCast\tShift\tAnalysed\tAnalyte\tReading\tUnit',
      'S1\tK24-0412\tA\t04.03.2024 06:00:00\tCr\t1250\t',
    ].join('\n');
    const parsed = parseResultFile(Buffer.from(file), { profile });
    expect(parsed.samples[0].burns[0]).toEqual({
      line: 4,
      burn_number: 1,
      measured_at: '2024-03-04T05:00:00.000Z',
      values: { Cr: { value: '0.125', qualifier: null, raw: '1250', unit: 'ppm' } },
    });
  });
});
