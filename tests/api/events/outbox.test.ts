// The transactional outbox: every change records its event in the same transaction, with the
// resource as the API returns it, and each event takes the next sequence.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  analyst = (await signedInAgent(t, 'analyst')).agent;
});
afterAll(() => t.close());

interface StoredEvent {
  sequence: number;
  id: string;
  type: string;
  instrument_id: string | null;
  data: Record<string, unknown>;
}

async function eventsAfter(sequence: number): Promise<StoredEvent[]> {
  const rows = await t.db('events').where('sequence', '>', sequence).orderBy('sequence');
  return rows.map((r) => ({ ...r, sequence: Number(r.sequence), data: JSON.parse(r.data_json) }));
}

async function lastSequence(): Promise<number> {
  const [row] = await t.db('events').max({ s: 'sequence' });
  return Number(row.s ?? 0);
}

function steel(code: string) {
  return {
    sample_code: code,
    heat: code.slice(0, 8),
    instrument_id: lab.foundry.id,
    method_id: lab.feMethod.id,
    burns: [{ values: { Mn: 0.75, C: 0.45 } }, { values: { Mn: 0.76, C: '<0.002' } }],
  };
}

const FILE = [
  'Sample,Heat,Burn,Mn %,C %',
  'K24-0900-F1,K24-0900,1,0.75,0.452',
  'K24-0900-F1,K24-0900,2,0.76,0.448',
  'K24-0901-F1,K24-0901,1,0.80,0.20',
  '',
].join('\n');

function upload(bytes: string, name = 'results.csv') {
  return analyst
    .post('/api/v1/imports')
    .field('instrument_id', lab.foundry.id)
    .field('method_id', lab.feMethod.id)
    .attach('file', Buffer.from(bytes), name);
}

describe('events recorded with their change', () => {
  it('a pushed sample records sample.created holding the sample as GET /samples/{id} returns it', async () => {
    const before = await lastSequence();
    const res = await analyst.post('/api/v1/samples').send(steel('K24-0800-F1'));
    expect(res.status).toBe(201);
    const events = await eventsAfter(before);
    expect(events.map((e) => e.type)).toEqual(['sample.created']);
    const detail = await analyst.get(`/api/v1/samples/${res.body.id}`);
    expect(events[0].data).toEqual(detail.body);
    expect(events[0].instrument_id).toBe(lab.foundry.id);
    expect(events[0].id).toMatch(/^evt_/);
  });

  it('a batch records one event per sample, in request order, with increasing sequences', async () => {
    const before = await lastSequence();
    const res = await analyst.post('/api/v1/samples/batch').send({ samples: [steel('K24-0801-F1'), steel('K24-0802-F1')] });
    expect(res.status).toBe(201);
    const events = await eventsAfter(before);
    expect(events.map((e) => (e.data as { sample_code: string }).sample_code)).toEqual(['K24-0801-F1', 'K24-0802-F1']);
    expect(events[1].sequence).toBeGreaterThan(events[0].sequence);
  });

  it('an import records sample.created for each sample, then import.completed holding the import', async () => {
    const before = await lastSequence();
    const res = await upload(FILE);
    expect(res.status).toBe(201);
    const events = await eventsAfter(before);
    expect(events.map((e) => e.type)).toEqual(['sample.created', 'sample.created', 'import.completed']);
    const [first, , completed] = events;
    expect(completed.data).toEqual((await analyst.get(`/api/v1/imports/${res.body.id}`)).body);
    const sampleId = (first.data as { id: string }).id;
    expect(first.data).toEqual((await analyst.get(`/api/v1/samples/${sampleId}`)).body);
    expect(first.data).toMatchObject({ source: 'import', provenance: { import_id: res.body.id, file_name: 'results.csv' } });
  });

  it('a refused upload records import.failed (file, instrument, method, the problem) and nothing else', async () => {
    const before = await lastSequence();
    const broken = 'Sample,Burn,Mn %\nK24-0902-F1,1,0.7x5\n';
    const res = await upload(broken, 'broken.csv');
    expect(res.status).toBe(422);
    const events = await eventsAfter(before);
    expect(events.map((e) => e.type)).toEqual(['import.failed']);
    expect(events[0].instrument_id).toBe(lab.foundry.id);
    expect(events[0].data).toMatchObject({
      file: { name: 'broken.csv', size_bytes: broken.length },
      instrument_id: lab.foundry.id,
      method_id: lab.feMethod.id,
      problem: { status: 422, detail: res.body.detail },
    });
    expect((events[0].data.file as { sha256: string }).sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('a sample whose push is refused records no event', async () => {
    const before = await lastSequence();
    const res = await analyst.post('/api/v1/samples').send({ ...steel('K24-0803-F1'), method_id: 'mth_nope' });
    expect(res.status).toBe(422);
    expect(await eventsAfter(before)).toEqual([]);
  });
});
