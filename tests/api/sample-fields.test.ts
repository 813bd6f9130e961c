// The lab's definitions of custom sample fields: read by anyone who reads samples, replaced by a
// manager or admin (lab-wide), audited, validated.
import { describe, expect, it } from 'vitest';
import { expectProblem, problemBody, signedInAgent, useDemoLab } from '../helpers/test-app.ts';

const env = useDemoLab('viewer');

describe('/api/v1/sample-fields', () => {
  it('starts empty, is replaced whole by a manager in the given order, and is audited', async () => {
    const empty = await env.agent.get('/api/v1/sample-fields');
    expect(empty.status).toBe(200);
    expect(empty.headers['content-type']).toMatch(/^application\/json/);
    expect(empty.body).toEqual({ data: [] });

    const { agent: manager } = await signedInAgent(env.t, 'manager');
    const put = await manager.put('/api/v1/sample-fields').send({
      fields: [
        { key: 'furnace', label: 'Furnace', description: 'The melting furnace of the heat.' },
        { key: 'cast_station', label: '  Casting station ' },
      ],
    });
    expect(put.status).toBe(200);
    expect(put.body.data.map((f: { key: string; label: string; description: string | null }) => [f.key, f.label, f.description])).toEqual([
      ['furnace', 'Furnace', 'The melting furnace of the heat.'],
      ['cast_station', 'Casting station', null],
    ]);
    expect((await env.agent.get('/api/v1/sample-fields')).body).toEqual(put.body);

    const replaced = await manager.put('/api/v1/sample-fields').send({ fields: [{ key: 'cast_station', label: 'Casting station' }] });
    expect(replaced.body.data.map((f: { key: string }) => f.key)).toEqual(['cast_station']);
    const audit = await manager.get('/api/v1/audit-events').query({ action: 'sample_fields.replaced' });
    expect(audit.body.data).toHaveLength(2);
    expect(audit.body.data[0]).toMatchObject({ after: [{ key: 'cast_station', label: 'Casting station' }] });
  });

  it('refuses viewers and analysts, a key listed twice and an empty label, storing nothing', async () => {
    expectProblem(await env.agent.put('/api/v1/sample-fields').send({ fields: [] }), 403);
    const { agent: analyst } = await signedInAgent(env.t, 'analyst');
    expectProblem(await analyst.put('/api/v1/sample-fields').send({ fields: [] }), 403);
    const { agent: admin } = await signedInAgent(env.t, 'admin');
    const before = (await env.agent.get('/api/v1/sample-fields')).body;
    const twice = await admin.put('/api/v1/sample-fields').send({
      fields: [
        { key: 'furnace', label: 'Furnace' },
        { key: 'furnace', label: 'Melting furnace' },
      ],
    });
    expectProblem(twice, 400);
    expect(problemBody(twice).errors?.[0].message).toContain('list each key once');
    expectProblem(await admin.put('/api/v1/sample-fields').send({ fields: [{ key: 'furnace', label: ' ' }] }), 400);
    expect((await env.agent.get('/api/v1/sample-fields')).body).toEqual(before);
  });
});
