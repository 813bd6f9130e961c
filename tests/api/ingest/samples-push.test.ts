// JSON push, reading samples back, units, burn exclusion, lists and the CSV export.
import { Decimal } from 'decimal.js';
import { sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { expectProblem, problemBody, signedInAgent, useDemoLab } from '../../helpers/test-app.ts';

const env = useDemoLab('analyst');

function steel(code: string, burns: Record<string, number | string>[], extra: Record<string, unknown> = {}) {
  return {
    sample_code: code,
    heat: code.slice(0, 8),
    grade: 'SAE 1045',
    kind: 'final',
    instrument_id: env.lab.foundry.id,
    method_id: env.lab.feMethod.id,
    burns: burns.map((values) => ({ values })),
    ...extra,
  };
}

const countSamples = async () => Number((await env.t.db('samples').count({ n: '*' }))[0].n);

describe('POST /api/v1/samples', () => {
  it('stores the burns and returns results that agree with an independent calculation', async () => {
    const mn = [0.744, 0.751, 0.755];
    const res = await env.agent.post('/api/v1/samples').send(
      steel('K24-0412-F1', [
        { mn: mn[0], C: 0.452 },
        { MN: mn[1], C: 0.449 },
        { Mn: mn[2], c: 0.455 },
      ]),
    );
    expect(res.status).toBe(201);
    expect(res.headers.location).toBe(`/api/v1/samples/${res.body.id}`);
    const result = res.body.results.find((r: { element: string }) => r.element === 'Mn');
    // Independent: decimal.js for the exact mean and the half-even rounding, simple-statistics for the SD.
    const mean = mn.reduce((sum, v) => sum.plus(v), new Decimal(0)).div(3);
    expect(result.mean).toBe(mean.toNumber());
    expect(result.reported).toBe(mean.toDecimalPlaces(2, Decimal.ROUND_HALF_EVEN).toFixed(2));
    expect(result.sd).toBeCloseTo(sampleStandardDeviation(mn), 12);
    expect(result.rsd).toBeCloseTo((100 * sampleStandardDeviation(mn)) / mean.toNumber(), 10);
    expect(result).toMatchObject({ n: 3, unit: '%', raw_mean: result.mean, qualifier: null, decimals: 2, min: 0.744, max: 0.755 });
    expect(res.body.results.map((r: { element: string }) => r.element)).toEqual(['C', 'Mn']);
    expect(res.body.burns).toHaveLength(3);
    expect(res.body.burns[1].values.Mn).toEqual({ value: 0.751, qualifier: null, raw: '0.751', raw_unit: '%', corrected: null });
    expect(res.body).toMatchObject({
      status: 'draft',
      source: 'push',
      instrument: { code: 'OES-1' },
      method: { code: 'FE-LA' },
      provenance: { source: 'push', import_id: null },
    });
  });

  it('rounds an exact tie half to even, from the decimal mean (ASTM E29)', async () => {
    // Exact means 0.125, 0.135, 0.145 → 0.12, 0.14, 0.14: ties go to the even digit (ASTM E29 examples 12.25 → 12.2, 12.35 → 12.4, 12.45 → 12.4).
    for (const [a, b, expected] of [
      [0.12, 0.13, '0.12'],
      [0.13, 0.14, '0.14'],
      [0.14, 0.15, '0.14'],
    ] as const) {
      const res = await env.agent.post('/api/v1/samples').send(steel('K24-0413-F1', [{ Cr: a }, { Cr: b }]));
      expect(res.body.results[0]).toMatchObject({ element: 'Cr', reported: expected });
    }
  });

  it('keeps qualified values and converts exactly to ppm on request', async () => {
    const created = await env.agent.post('/api/v1/samples').send(
      steel(
        'K24-0414-F1',
        [
          { S: '<0.002', B: 0.0004 },
          { S: '<0.002', B: '0.0005' },
        ],
        { unit: '%' },
      ),
    );
    const ppm = await env.agent.get(`/api/v1/samples/${created.body.id}`).query({ unit: 'ppm' });
    expect(ppm.status).toBe(200);
    const s = ppm.body.results.find((r: { element: string }) => r.element === 'S');
    const b = ppm.body.results.find((r: { element: string }) => r.element === 'B');
    expect(s).toMatchObject({ qualifier: '<', reported: '20', unit: 'ppm', flags: expect.arrayContaining(['all_burns_qualified']) });
    // 1 % = 10 000 mg/kg (NIST SP 811 §7.10): 0.00045 % = 4.5 ppm; B has 4 decimals in % → 0 in ppm, half-even → "4".
    expect(b).toMatchObject({ mean: 4.5, reported: '4', decimals: 0, unit: 'ppm' });
    expect(ppm.body.burns[0].values.B).toEqual({ value: 4, qualifier: null, raw: '0.0004', raw_unit: '%', corrected: null });
  });

  it('reports in ppm and ppb from the mean in that unit at whole units, not the % rounding scaled', async () => {
    // Si at 2 decimals in %: mean 0.5943 % → "0.59" %, but 5943 ppm and 5 943 000 ppb (1 % = 10^4 ppm = 10^7 ppb, NIST SP 811).
    const created = await env.agent.post('/api/v1/samples').send(steel('K24-0431-F1', [{ Si: '0.5941' }, { Si: '0.5945' }]));
    const si = (unit: string) =>
      env.agent
        .get(`/api/v1/samples/${created.body.id}`)
        .query({ unit })
        .then((res) => res.body.results.find((r: { element: string }) => r.element === 'Si'));
    expect(await si('%')).toMatchObject({ reported: '0.59', decimals: 2 });
    const ppm = await si('ppm');
    // Independent: decimal.js half-even (ASTM E29) of the mean in ppm, to whole ppm.
    expect(ppm).toMatchObject({ mean: 5943, decimals: 0 });
    expect(ppm.reported).toBe(new Decimal(ppm.mean).toDecimalPlaces(0, Decimal.ROUND_HALF_EVEN).toFixed(0));
    expect(await si('ppb')).toMatchObject({ reported: '5943000', decimals: 0 });
  });

  it('accepts values pushed in ppm and stores them canonically in %', async () => {
    const res = await env.agent.post('/api/v1/samples').send(
      steel(
        'K24-0415-F1',
        [
          { N: 85, B: 4 },
          { N: 95, B: 5 },
        ],
        { unit: 'ppm' },
      ),
    );
    expect(res.status).toBe(201);
    const n = res.body.results.find((r: { element: string }) => r.element === 'N');
    expect(n.mean).toBe(0.009);
    expect(res.body.burns[0].values.N).toEqual({ value: 0.0085, qualifier: null, raw: '85', raw_unit: 'ppm', corrected: null });
    expect(n.flags).toContain('not_in_method');
    expect(n.reported).toBeNull(); // outside the method: kept, averaged, not reported
  });

  it('names every unreadable value and stores nothing', async () => {
    const before = await countSamples();
    const res = await env.agent.post('/api/v1/samples').send(steel('K24-0416-F1', [{ Xx: 1, Mn: 'abc' }, { Mn: -0.5, C: '0.4.5' }, {}]));
    expectProblem(res, 400);
    expect(
      problemBody(res)
        .errors?.map((e) => e.location)
        .sort(),
    ).toEqual([
      'body.burns.0.values.Mn',
      'body.burns.0.values.Xx',
      'body.burns.1.values.C',
      'body.burns.1.values.Mn',
      'body.burns.2.values',
    ]);
    expect(await countSamples()).toBe(before);
  });

  it('answers 422 for an unknown instrument or method', async () => {
    const res = await env.agent
      .post('/api/v1/samples')
      .send({ ...steel('K24-0417-F1', [{ Mn: 0.7 }]), instrument_id: 'ins_nope', method_id: 'mth_nope' });
    expectProblem(res, 422);
    expect(
      problemBody(res)
        .errors?.map((e) => e.location)
        .sort(),
    ).toEqual(['body.instrument_id', 'body.method_id']);
  });

  it('stores a batch all or nothing', async () => {
    const before = await countSamples();
    const bad = await env.agent
      .post('/api/v1/samples/batch')
      .send({ samples: [steel('K24-0418-F1', [{ Mn: 0.7 }]), steel('K24-0418-F2', [{ Mn: 'x' }])] });
    expectProblem(bad, 400);
    expect(problemBody(bad).errors?.[0].location).toBe('body.samples.1.burns.0.values.Mn');
    expect(await countSamples()).toBe(before);
    const good = await env.agent
      .post('/api/v1/samples/batch')
      .send({ samples: [steel('K24-0418-F1', [{ Mn: 0.7 }]), steel('K24-0418-F2', [{ Mn: 0.71 }])] });
    expect(good.status).toBe(201);
    expect(good.body.data.map((s: { sample_code: string }) => s.sample_code)).toEqual(['K24-0418-F1', 'K24-0418-F2']);
    expect(await countSamples()).toBe(before + 2);
  });

  it('is closed to viewers', async () => {
    const { agent } = await signedInAgent(env.t, 'viewer');
    expectProblem(await agent.post('/api/v1/samples').send(steel('K24-0419-F1', [{ Mn: 0.7 }])), 403);
  });
});

describe('PATCH /api/v1/samples/{id}/burns/{n}', () => {
  it('excludes a burn with a reason, recomputes, audits, and includes it again', async () => {
    const created = await env.agent.post('/api/v1/samples').send(steel('K24-0420-F1', [{ Mn: 0.75 }, { Mn: 0.76 }, { Mn: 0.95 }]));
    expect(created.body.results[0].flags).toContain('repeatability_exceeded');
    const id = created.body.id;

    expectProblem(await env.agent.patch(`/api/v1/samples/${id}/burns/3`).send({ excluded: true }), 400);
    const excluded = await env.agent.patch(`/api/v1/samples/${id}/burns/3`).send({ excluded: true, reason: 'porous spot, visible crater' });
    expect(excluded.status).toBe(200);
    expect(excluded.body.results[0]).toMatchObject({ n: 2, reported: '0.76' });
    expect(excluded.body.results[0].flags).not.toContain('repeatability_exceeded');
    expect(excluded.body.burns[2]).toMatchObject({
      excluded: true,
      exclusion: { reason: 'porous spot, visible crater' },
      values: { Mn: { value: 0.95 } },
    });

    const { agent: manager } = await signedInAgent(env.t, 'manager');
    const audit = await manager.get('/api/v1/audit-events').query({ target_id: id, action: 'sample.burn_excluded' });
    expect(audit.body.data[0]).toMatchObject({
      before: { burn: { number: 3, excluded: false } },
      after: { burn: { number: 3, excluded: true }, reason: 'porous spot, visible crater' },
    });

    const included = await env.agent
      .patch(`/api/v1/samples/${id}/burns/3`)
      .send({ excluded: false, reason: 'crater was on the other sample' });
    expect(included.body.results[0].n).toBe(3);
    expectProblem(await env.agent.patch(`/api/v1/samples/${id}/burns/9`).send({ excluded: true, reason: 'no such burn' }), 404);
  });

  it('never excludes the last included burn', async () => {
    const created = await env.agent.post('/api/v1/samples').send(steel('K24-0421-F1', [{ Mn: 0.75 }]));
    expectProblem(
      await env.agent.patch(`/api/v1/samples/${created.body.id}/burns/1`).send({ excluded: true, reason: 'would leave nothing' }),
      409,
    );
  });
});

describe('GET /api/v1/samples', () => {
  it('filters, pages without gaps, and follows updated_since in change order', async () => {
    const heat = 'K24-0500';
    const ids: string[] = [];
    for (let i = 0; i < 5; i++)
      ids.push((await env.agent.post('/api/v1/samples').send(steel(`${heat}-F${i}`, [{ Mn: 0.7 + i / 100 }], { heat }))).body.id);
    const seen: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await env.agent.get('/api/v1/samples').query({ heat, limit: 2, ...(cursor ? { cursor } : {}) });
      expect(page.status).toBe(200);
      seen.push(...page.body.data.map((s: { id: string }) => s.id));
      cursor = page.body.next_cursor ?? undefined;
    } while (cursor);
    expect(seen).toEqual([...ids].reverse());

    const since = new Date(Date.now() - 60_000).toISOString();
    await env.agent.patch(`/api/v1/samples/${ids[0]}/burns/1`).send({ excluded: false, reason: 'no change' });
    const changed = await env.agent.get('/api/v1/samples').query({ heat, updated_since: since });
    expect(changed.body.data.map((s: { id: string }) => s.id)).toEqual(ids);

    const flagged = await env.agent.get('/api/v1/samples').query({ flag: 'repeatability_exceeded' });
    expect(flagged.body.data.every((s: { flags: string[] }) => s.flags.includes('repeatability_exceeded'))).toBe(true);
    expectProblem(await env.agent.get('/api/v1/samples').query({ kind: 'molten' }), 400);
  });
});

describe('GET /api/v1/samples.csv', () => {
  it('exports reported values with qualifiers and neutralises formula cells', async () => {
    await env.agent.post('/api/v1/samples').send(steel('=HYPERLINK("http://x.test")', [{ Mn: 0.71, S: '<0.002' }], { heat: 'K24-0600' }));
    const res = await env.agent.get('/api/v1/samples.csv').query({ heat: 'K24-0600' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const [header, row] = res.text.trim().split('\n');
    expect(header).toBe('id,sample_code,heat,grade,kind,status,instrument,method,created_at,updated_at,flags,conforms,Mn [%],S [%]');
    expect(row).toContain(`"'=HYPERLINK(""http://x.test"")"`);
    expect(row.endsWith(',0.71,<0.002')).toBe(true);
  });
});

describe('time filters', () => {
  it('compare times, not text, whatever offset the caller writes', async () => {
    const created = await env.agent.post('/api/v1/samples').send(steel('K24-0700-F9', [{ Mn: 0.7 }], { heat: 'K24-0700' }));
    const at = new Date(created.body.created_at);
    // The same instant written one hour ahead with +01:00: as text it sorts after the stored UTC time.
    const sameInstant = new Date(at.getTime() + 3600_000).toISOString().replace('Z', '+01:00');
    const since = await env.agent.get('/api/v1/samples').query({ heat: 'K24-0700', updated_since: sameInstant });
    expect(since.body.data.map((s: { id: string }) => s.id)).toEqual([created.body.id]);
    const before = await env.agent.get('/api/v1/samples').query({ heat: 'K24-0700', created_to: sameInstant });
    expect(before.body.data).toEqual([]);
  });
});
