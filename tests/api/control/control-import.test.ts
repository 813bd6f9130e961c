// A control measurement in a result file is linked to its definition by its sample code (ignoring
// case), with or without a kind column, and judged on the chart like a pushed one; a row that says
// another kind is not a control measurement, whatever its code.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;
let controlId: string;

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  analyst = (await signedInAgent(t, 'analyst')).agent;
  const created = await analyst.post('/api/v1/control-samples').send({
    instrument_id: lab.foundry.id,
    method_id: lab.feMethod.id,
    code: 'CTRL-FE-7',
    kind: 'in_house',
    elements: [{ element: 'C', centre: '0.450', sd: '0.005', source: 'earlier chart', valid_from: '2026-01-01T00:00:00Z' }],
  });
  expect(created.status).toBe(201);
  controlId = created.body.id;
});
afterAll(() => t.close());

function upload(csv: string) {
  return analyst
    .post('/api/v1/imports')
    .field('instrument_id', lab.foundry.id)
    .field('method_id', lab.feMethod.id)
    .field('mode', 'all_or_nothing')
    .attach('file', Buffer.from(csv), 'results.csv');
}

const chart = async () => (await analyst.get(`/api/v1/control-samples/${controlId}/chart`).query({ element: 'C' })).body;

describe('control measurements imported from a file', () => {
  it('links a row by its sample code, ignoring case, when the file has no kind column', async () => {
    const res = await upload(
      [
        'Sample,Burn,Time,C %',
        'ctrl-fe-7,1,2026-11-30T06:00:00Z,0.451',
        'ctrl-fe-7,2,2026-11-30T06:01:00Z,0.449',
        'K24-0700-F1,1,2026-11-30T07:00:00Z,0.452',
        '',
      ].join('\n'),
    );
    expect(res.status).toBe(201);
    const body = await chart();
    expect(body.points).toHaveLength(1);
    expect(body.points[0]).toMatchObject({ sample_code: 'ctrl-fe-7', value: 0.45, burns_n: 2, violations: [] });
    const sample = await analyst.get(`/api/v1/samples/${body.points[0].sample_id}`);
    expect(sample.body.kind).toBe('control');
    const heat = (await analyst.get('/api/v1/samples').query({ sample_code: 'K24-0700-F1' })).body.data[0];
    expect(heat.kind).toBeNull();
  });

  it('judges an imported point: beyond 3σ puts the instrument in verify', async () => {
    // 0.480 is 6 SD above the 0.450 centre line (Western Electric 1956, test 1).
    const res = await upload(['Sample,Kind,Burn,Time,C %', 'CTRL-FE-7,control,1,2026-12-01T06:00:00Z,0.480', ''].join('\n'));
    expect(res.status).toBe(201);
    const body = await chart();
    expect(body.points.map((p: { violations: { rule: string }[] }) => p.violations.map((v) => v.rule))).toEqual([[], ['beyond_3s']]);
    const instrument = await analyst.get(`/api/v1/instruments/${lab.foundry.id}`);
    expect(instrument.body.control).toEqual([
      expect.objectContaining({
        method_id: lab.feMethod.id,
        status: 'verify',
        reason: expect.objectContaining({ sample_id: body.points[1].sample_id }),
      }),
    ]);
  });

  it('leaves a row of another kind unlinked, even with the control code', async () => {
    const res = await upload(['Sample,Kind,Burn,Time,C %', 'CTRL-FE-7,final,1,2026-12-02T06:00:00Z,0.450', ''].join('\n'));
    expect(res.status).toBe(201);
    expect((await chart()).points).toHaveLength(2);
  });
});
