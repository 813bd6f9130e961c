// GET /samples and /samples/{id} in % are served from documents prepared when each sample changed
// (server/domain/samples/prepared-documents.ts). They must be byte for byte what the same request
// computes afresh, every write path must leave them current, and a stale one is never served.
import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DOCUMENT_VERSION, prepareStaleDocuments } from '../../../server/domain/samples/prepared-documents.ts';
import { seedDemoIfEmpty } from '../../../server/seed/demo.ts';
import { createTestApp, issueKey, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let manager: request.Agent;
let reader: string;

beforeAll(async () => {
  t = await createTestApp();
  await seedDemoIfEmpty(t.db);
  manager = (await signedInAgent(t, 'manager')).agent;
  reader = (await issueKey(t, ['samples:read'])).secret;
}, 60_000);
afterAll(() => t?.close());

const get = (path: string) => request(t.app).get(path).set('authorization', `Bearer ${reader}`);

/** Every sample's stored documents dropped: the next reads compute them afresh. */
async function dropDocuments(): Promise<void> {
  await t.db('samples').update({ doc_key: null, summary_doc: null, detail_doc: null });
}

/** The text GET answers now, and again with every document dropped (computed afresh). */
async function servedAndFresh(path: string): Promise<[string, string]> {
  const served = await get(path);
  expect(served.status).toBe(200);
  await dropDocuments();
  const fresh = await get(path);
  await prepareStaleDocuments(t.db);
  return [served.text, fresh.text];
}

/** A sample's stored single-sample document next to the same sample computed afresh. */
async function storedAndFresh(id: string): Promise<[string | null, string]> {
  const { detail_doc } = await t.db('samples').where({ id }).first('detail_doc');
  const { doc_key } = await t.db('samples').where({ id }).first('doc_key');
  await t.db('samples').where({ id }).update({ doc_key: null });
  const fresh = await get(`/api/v1/samples/${id}`);
  await t.db('samples').where({ id }).update({ doc_key });
  return [detail_doc, fresh.text];
}

describe('prepared documents', () => {
  it('serves list pages byte for byte as computed afresh, on both orders and every page', async () => {
    let cursor: string | null = null;
    let pages = 0;
    do {
      const path = `/api/v1/samples?limit=40${cursor ? `&cursor=${cursor}` : ''}`;
      const [served, fresh] = await servedAndFresh(path);
      expect(served).toBe(fresh);
      cursor = JSON.parse(served).next_cursor;
      pages++;
    } while (cursor);
    expect(pages).toBeGreaterThan(3);
    const [served, fresh] = await servedAndFresh('/api/v1/samples?updated_since=2000-01-01T00:00:00Z&limit=200&kind=final');
    expect(served).toBe(fresh);
    expect(JSON.parse(served).data.length).toBeGreaterThan(0);
  });

  it('serves a single sample (released, imported, corrected, control) byte for byte as computed afresh', async () => {
    const ids: string[] = (await t.db('samples').select('id')).map((row: { id: string }) => row.id);
    expect(ids.length).toBeGreaterThan(100);
    for (const id of ids) {
      const [stored, fresh] = await storedAndFresh(id);
      expect(stored, id).toBe(fresh);
    }
  });

  it('really serves the stored text, and never a stale one', async () => {
    const { id, detail_doc } = await t.db('samples').first('id', 'detail_doc');
    const marked = detail_doc.replace('"sample_code":"', '"sample_code":"PREPARED-');
    await t.db('samples').where({ id }).update({ detail_doc: marked });
    expect((await get(`/api/v1/samples/${id}`)).body.sample_code).toMatch(/^PREPARED-/);
    // A write that did not prepare the documents (it changed updated_at): computed afresh.
    await t.db('samples').where({ id }).update({ updated_at: new Date().toISOString() });
    const res = await get(`/api/v1/samples/${id}`);
    expect(res.body.sample_code).not.toMatch(/^PREPARED-/);
    expect(res.body.updated_at).toBe((await t.db('samples').where({ id }).first('updated_at')).updated_at);
    await prepareStaleDocuments(t.db);
  });

  it('shows a renamed instrument at once, and prepares its samples again at the next back-fill', async () => {
    const instrument = await t.db('instruments').where({ code: 'OES-2' }).first();
    const admin = (await signedInAgent(t, 'admin')).agent;
    expect((await admin.patch(`/api/v1/instruments/${instrument.id}`).send({ code: 'OES-2B' })).status).toBe(200);
    const page = await get(`/api/v1/samples?instrument_id=${instrument.id}&limit=5`);
    expect(page.body.data.map((s: { instrument: { code: string } }) => s.instrument.code)).toEqual(Array(5).fill('OES-2B'));
    expect(await prepareStaleDocuments(t.db)).toBeGreaterThan(5);
    expect(await prepareStaleDocuments(t.db)).toBe(0);
    await admin.patch(`/api/v1/instruments/${instrument.id}`).send({ code: 'OES-2' });
    await prepareStaleDocuments(t.db);
  });

  it('is current after every write: push, batch, burn exclusion, recompute, release, amendment', async () => {
    const { instrument_id, method_id } = await t
      .db('samples')
      .where({ kind: 'final', status: 'draft' })
      .first('instrument_id', 'method_id');
    const burns = [{ values: { C: 0.45, Mn: 0.75 } }, { values: { C: 0.46, Mn: 0.74 } }, { values: { C: 0.47, Mn: 0.76 } }];
    const pushed = await manager.post('/api/v1/samples').send({ sample_code: 'PD-1', instrument_id, method_id, burns });
    expect(pushed.status).toBe(201);
    const [stored, fresh] = await storedAndFresh(pushed.body.id);
    expect(stored).toBe(fresh);
    expect(pushed.text).toBe(fresh);
    const batch = await manager.post('/api/v1/samples/batch').send({ samples: [{ sample_code: 'PD-2', instrument_id, method_id, burns }] });
    expect(batch.status).toBe(201);
    const id = pushed.body.id as string;
    // Another person releases what this manager pushed and changed.
    const second = (await signedInAgent(t, 'manager')).agent;
    const steps = [
      () => manager.patch(`/api/v1/samples/${id}/burns/3`).send({ excluded: true, reason: 'bad spark' }),
      () => manager.post(`/api/v1/samples/${id}/recompute`).send({ correction_set_id: null, reason: 'as measured' }),
      () =>
        second
          .post(`/api/v1/samples/${id}/release`)
          .send({ accept_nonconforming: true, comment: 'no grade named', acknowledge_control: { comment: 'checked' } }),
      () => second.post(`/api/v1/samples/${id}/amendments`).send({ reason: 'heat typo', heat: 'PD-HEAT' }),
    ];
    for (const [i, step] of steps.entries()) {
      const res = await step();
      expect(res.status, `step ${i}: ${res.text}`).toBeLessThan(300);
      const [after, afresh] = await storedAndFresh(id);
      expect(after, `step ${i}`).toBe(afresh);
    }
    const [batched, batchedFresh] = await storedAndFresh(batch.body.data[0].id);
    expect(batched).toBe(batchedFresh);
  });

  it('is prepared soon after an import and after a grade changes its verdicts (both touch many samples at once)', async () => {
    const { instrument_id, method_id } = await t.db('samples').where({ kind: 'final' }).first('instrument_id', 'method_id');
    const csv = [
      'Sample,Heat,Grade,Burn,C %,Mn %',
      ...Array.from({ length: 30 }, (_, i) => `PD-I${i},PD-H${i},PD-GRADE,1,0.4${i % 10},0.75`),
      '',
    ];
    const imported = await manager
      .post('/api/v1/imports')
      .field('instrument_id', instrument_id)
      .field('method_id', method_id)
      .attach('file', Buffer.from(csv.join('\n')), 'pd.csv');
    expect(imported.status).toBe(201);
    const current = async (where: Record<string, string>) => {
      const rows = await t.db('samples').where(where).select('id', 'detail_doc');
      for (const row of rows) {
        const [stored, fresh] = await storedAndFresh(row.id);
        if (stored !== fresh) return false;
      }
      return rows.length;
    };
    await expect.poll(() => current({ import_id: imported.body.id }), { timeout: 10_000 }).toBe(30);
    const grader = (await issueKey(t, ['grades:write', 'grades:read'])).secret;
    const grade = await request(t.app)
      .post('/api/v1/grades')
      .set('authorization', `Bearer ${grader}`)
      .send({
        code: 'PD-GRADE',
        title: 'Steel',
        standard: 'none',
        matrix: 'Fe',
        decision_rule: 'rounding',
        limits: [{ element: 'C', max: '0.45' }],
      });
    expect(grade.status).toBe(201);
    await expect.poll(() => current({ grade: 'PD-GRADE' }), { timeout: 10_000 }).toBe(30);
    expect(JSON.parse((await t.db('samples').where({ sample_code: 'PD-I9' }).first('summary_doc')).summary_doc).conformance).not.toBeNull();
  });

  it(`pins the representation to DOCUMENT_VERSION ${DOCUMENT_VERSION}: change one, change the other`, async () => {
    // If this fails, the API representation of a sample changed: bump DOCUMENT_VERSION in
    // server/domain/samples/prepared-documents.ts (so documents made before are prepared again),
    // then update the fingerprint here.
    // A lab without correction sets, so nothing but the representation decides the text.
    const own = await createTestApp();
    const lab = await seedDemoLab(own.db);
    const { agent } = await signedInAgent(own, 'analyst');
    const pushed = await agent.post('/api/v1/samples').send({
      instrument_id: lab.foundry.id,
      method_id: lab.feMethod.id,
      sample_code: 'PD-PIN',
      heat: 'PD-PIN',
      fields: { furnace: 'F2' },
      burns: [{ values: { C: 0.45, Mn: '<0.01' } }, { values: { C: 0.47, Mn: '<0.01' } }],
    });
    const shape = pushed.text
      .replace(/"(smp|ins|mth|imp|cs|std)_[^"]*"/g, '"id"')
      .replace(/\d{4}-\d\d-\d\dT[\d:.]+Z/g, 'time')
      .replace(/"(created_by|by)":"[^"]*"/g, '"$1":"someone"');
    const fingerprint = createHash('sha256').update(shape).digest('hex').slice(0, 16);
    await own.close();
    expect({ version: DOCUMENT_VERSION, fingerprint }).toEqual({ version: 1, fingerprint: '9eb51e20d29eb561' });
  });
});
