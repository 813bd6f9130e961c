// Reading the result file in which the references were sparked (POST
// /instruments/{id}/standardizations/file): the sample import's parser and profiles, sample codes
// matched to reference materials ignoring case and separators, burns in % limited to the method's
// elements, the measurement time from the file; then a run created from those burns records the file.
import { describe, expect, it } from 'vitest';
import { expectProblem } from '../../helpers/test-app.ts';
import { NOMINAL, useDriftSetup } from './drift-setup.ts';

const s = useDriftSetup();

/** The high reference written in lower case with spaces, the low one exactly, and a sample no reference matches. */
function resultFile(): string {
  const high = s.high.code.toLowerCase().replace(/-/g, ' ');
  return [
    'Sample;Burn;Time;C %;Mn %;Cr %;Ni ppm',
    `${high};1;2026-11-30T06:01:00Z;0,820;1,51;2,16;150`,
    `${high};2;2026-11-30T06:02:00Z;0,822;1,52;2,17;152`,
    `${s.low.code};1;2026-11-30T06:04:00Z;0,106;0,305;<0,002;149`,
    `${s.low.code};2;2026-11-30T06:05:30Z;0,107;0,306;0,251;151`,
    'K24-0412-F1;1;2026-11-30T06:09:00Z;0,40;0,70;0,10;140',
  ].join('\n');
}

const post = (body: string, fields: Record<string, string> = { method_id: s.method.id }, agent = s.analyst) => {
  const req = agent.post(`/api/v1/instruments/${s.lab.foundry.id}/standardizations/file`);
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  return req.attach('file', Buffer.from(body), { filename: 'standardization.csv', contentType: 'text/csv' });
};

describe('POST /instruments/{id}/standardizations/file', () => {
  it('reads the samples, matches their codes to reference materials and takes the time from the file', async () => {
    const res = await post(resultFile());
    expect(res.status).toBe(200);
    expect(res.body.method).toEqual({ id: s.method.id, code: s.method.code });
    expect(res.body.file).toMatchObject({ name: 'standardization.csv', sha256: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(res.body.samples.map((x: { reference_material: { id: string } | null }) => x.reference_material?.id ?? null)).toEqual([
      s.high.id,
      s.low.id,
      null,
    ]);
    const [high, low] = res.body.samples;
    // Decimal commas read as in the sample import; values in %, the method's elements only.
    expect(high.burns.map((b: { values: object }) => b.values)).toEqual([
      { C: '0.82', Mn: '1.51', Cr: '2.16' },
      { C: '0.822', Mn: '1.52', Cr: '2.17' },
    ]);
    expect(low.burns[0].values.Cr).toBe('<0.002');
    expect(low.measured_at).toBe('2026-11-30T06:05:30.000Z');
    // The latest burn of the matched samples, not of the unmatched production sample.
    expect(res.body.measured_at).toBe('2026-11-30T06:05:30.000Z');
    expect(res.body.elements_not_in_method).toEqual(['Ni']);
    expect(res.body.missing_elements).toEqual([]);
  });

  it('creates the run from the burns read, recording the file and the measurement time', async () => {
    const reading = (await post(resultFile())).body;
    const [high, low] = reading.samples;
    const res = await s.analyst.post(`/api/v1/instruments/${s.lab.foundry.id}/standardizations`).send({
      method_id: s.method.id,
      mode: 'two_point',
      unit: '%',
      measured_at: reading.measured_at,
      source_file: { name: reading.file.name, sha256: reading.file.sha256 },
      measurements: [
        { reference_material_id: high.reference_material.id, burns: high.burns.map((b: { values: object }) => ({ values: b.values })) },
        { reference_material_id: low.reference_material.id, burns: low.burns.map((b: { values: object }) => ({ values: b.values })) },
      ],
    });
    expect(res.status).toBe(201);
    expect(res.body.measured_at).toBe('2026-11-30T06:05:30.000Z');
    expect(res.body.source_file).toEqual({ name: 'standardization.csv', sha256: reading.file.sha256 });
    // C: α = (0.812 − 0.105)/(0.821 − 0.1065) = 0.707/0.7145 = 0.98950314905528341497…, by hand (two-point formula in PRODUCT.md).
    const c = res.body.corrections.find((x: { element: string }) => x.element === 'C');
    expect(c.slope.startsWith('0.989503149055283414')).toBe(true);
    expect(c.levels.map((l: { nominal: string }) => l.nominal)).toEqual([NOMINAL.high.C, NOMINAL.low.C]);
    const audit = await s.t.db('audit_events').where({ action: 'standardization.created', target_id: res.body.id }).first();
    expect(JSON.parse(audit.after_json).source_file).toEqual({ name: 'standardization.csv', sha256: reading.file.sha256 });
  });

  it('refuses an unreadable file with the problem the sample import gives, and unknown references with 422', async () => {
    const empty = await post('');
    expectProblem(empty, 422);
    expect(empty.body.issues[0].code).toBe('empty_file');

    const unknown = await post(resultFile(), { method_id: 'mth_nope', profile_id: 'prf_nope' });
    expectProblem(unknown, 422);
    expect(unknown.body.errors.map((e: { location: string }) => e.location)).toEqual(['body.method_id', 'body.profile_id']);
  });

  it('needs the file, the standardizations:write scope and a known instrument', async () => {
    const noFile = await s.analyst
      .post(`/api/v1/instruments/${s.lab.foundry.id}/standardizations/file`)
      .field('method_id', s.method.id)
      .attach('other', Buffer.from('x'), 'x.csv');
    expect(noFile.status).toBe(400);
    expectProblem(await post(resultFile(), { method_id: s.method.id }, s.viewer), 403);
    const missing = await s.analyst
      .post('/api/v1/instruments/ins_nope/standardizations/file')
      .field('method_id', s.method.id)
      .attach('file', Buffer.from(resultFile()), 'f.csv');
    expectProblem(missing, 404);
  });

  it('refuses a file larger than a standardization file can be (413)', async () => {
    const big = `${resultFile()}\n${'x'.repeat(1024 * 1024)}`;
    const res = await post(big);
    expectProblem(res, 413);
  });
});
