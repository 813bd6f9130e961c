// Releasing results: by a person holding samples:release, never by whoever created the sample or
// last changed its burns (independent release, on by default), as a concession with a comment when
// it does not conform; a heat's samples all or none; a released sample changes no more.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../server/seed/demo-lab.ts';
import { createTestApp, expectProblem, issueKey, problemBody, seedDemoLab, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;
let manager: request.Agent;

const GRADE = {
  code: 'SAE 1045',
  title: 'Medium-carbon steel',
  standard: 'SAE J403',
  matrix: 'Fe',
  decision_rule: 'rounding',
  limits: [{ element: 'C', min: '0.43', max: '0.50' }],
};
let n = 0;
async function push(agent: request.Agent, c: number, heat = 'K24-0900') {
  n += 1;
  const res = await agent.post('/api/v1/samples').send({
    sample_code: `${heat}-F${n}`,
    heat,
    grade: 'SAE 1045',
    instrument_id: lab.foundry.id,
    method_id: lab.feMethod.id,
    burns: [{ values: { C: c, Mn: 0.75 } }, { values: { C: c, Mn: 0.76 } }],
  });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  analyst = (await signedInAgent(t, 'analyst')).agent;
  manager = (await signedInAgent(t, 'manager')).agent;
  const grader = (await issueKey(t, ['grades:write', 'grades:read'])).secret;
  expect((await request(t.app).post('/api/v1/grades').set('authorization', `Bearer ${grader}`).send(GRADE)).status).toBe(201);
});
afterAll(() => t.close());

describe('release', () => {
  it('is refused without samples:release, and to whoever created the sample', async () => {
    const id = await push(analyst, 0.45);
    expectProblem(await analyst.post(`/api/v1/samples/${id}/release`).send({}), 403);
    const own = await push(manager, 0.45);
    const refused = await manager.post(`/api/v1/samples/${own}/release`).send({});
    expectProblem(refused, 403);
    expect(problemBody(refused).detail).toMatch(/another person/);
  });

  it('releases a conforming sample, records who and when, and the event', async () => {
    const id = await push(analyst, 0.45);
    const res = await manager.post(`/api/v1/samples/${id}/release`).send({ comment: 'Reviewed' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'released', revision: 1, release: { comment: 'Reviewed', concession: false } });
    expect(res.body.release.by).toMatch(/@kestrelbend\.test$/);
    const event = await t.db('events').where({ type: 'sample.released' }).first();
    expect(JSON.parse(event.data_json).sample).toMatchObject({ id, status: 'released' });
  });

  it('keeps a released sample as it is: burns, recompute and a second release answer 409', async () => {
    const id = await push(analyst, 0.45);
    await manager.post(`/api/v1/samples/${id}/release`).send({});
    expectProblem(await analyst.patch(`/api/v1/samples/${id}/burns/1`).send({ excluded: true, reason: 'bad spark' }), 409);
    expectProblem(
      await manager.post(`/api/v1/samples/${id}/recompute`).send({ correction_set_id: null, reason: 'apply the set again' }),
      409,
    );
    const again = await manager.post(`/api/v1/samples/${id}/release`).send({});
    expectProblem(again, 409);
    expect(problemBody(again).detail).toMatch(/amendments/);
  });

  it('needs a concession with a comment for a sample that does not conform', async () => {
    const id = await push(analyst, 0.6);
    const refused = await manager.post(`/api/v1/samples/${id}/release`).send({});
    expectProblem(refused, 422);
    expect(problemBody(refused).detail).toMatch(/does not conform.*concession/);
    expectProblem(await manager.post(`/api/v1/samples/${id}/release`).send({ accept_nonconforming: true }), 422);
    const conceded = await manager
      .post(`/api/v1/samples/${id}/release`)
      .send({ accept_nonconforming: true, comment: 'Customer accepted C 0.60 in writing' });
    expect(conceded.status).toBe(200);
    expect(conceded.body.release).toMatchObject({ concession: true, comment: 'Customer accepted C 0.60 in writing' });
  });

  it("releases a heat's samples all or none", async () => {
    const good = [await push(analyst, 0.45, 'K24-0950'), await push(analyst, 0.46, 'K24-0950')];
    const bad = await push(analyst, 0.7, 'K24-0950');
    const refused = await manager.post('/api/v1/samples/release').send({ sample_ids: [...good, bad] });
    expectProblem(refused, 422);
    expect(problemBody(refused).errors).toEqual([expect.objectContaining({ location: 'body.sample_ids.2' })]);
    const still = await manager.get('/api/v1/samples').query({ heat: 'K24-0950', status: 'draft' });
    expect(still.body.data).toHaveLength(3);
    const released = await manager.post('/api/v1/samples/release').send({ sample_ids: good });
    expect(released.status).toBe(200);
    expect(released.body.data.map((s: { status: string }) => s.status)).toEqual(['released', 'released']);
  });

  it('lets the creator release when the lab turns independent release off', async () => {
    const relaxed = await createTestApp({ releaseRequiresSecondPerson: false });
    try {
      const relaxedLab = await seedDemoLab(relaxed.db);
      const { agent } = await signedInAgent(relaxed, 'manager');
      const pushed = await agent.post('/api/v1/samples').send({
        sample_code: 'K24-0990-F1',
        instrument_id: relaxedLab.foundry.id,
        method_id: relaxedLab.feMethod.id,
        burns: [{ values: { C: 0.45 } }],
      });
      const res = await agent
        .post(`/api/v1/samples/${pushed.body.id}/release`)
        .send({ accept_nonconforming: true, comment: 'No grade named' });
      expect(res.status).toBe(200);
    } finally {
      await relaxed.close();
    }
  });
});
