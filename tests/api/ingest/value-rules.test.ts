// One rule for values on every way in (JSON push, batch, file import): finite, not negative, at
// most 100 % once converted, and the same cause in the same words. Push messages name sample,
// burn and element; file issues name line and column. The same unit spellings everywhere.
// Expected conversions computed with decimal.js (1 % = 10 000 mg/kg = 10 000 000 µg/kg, SI
// brochure / NIST SP 811 §7.10, docs/references.md).
import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { countRows, expectProblem, problemBody, useDemoLab } from '../../helpers/test-app.ts';

const env = useDemoLab('analyst');

const sample = (code: string, values: Record<string, unknown>, unit?: string) => ({
  sample_code: code,
  instrument_id: env.lab.foundry.id,
  method_id: env.lab.feMethod.id,
  ...(unit ? { unit } : {}),
  burns: [{ values: { Mn: 0.75 } }, { values: { Mn: 0.76, ...values } }],
});

function upload(csv: string) {
  return env.agent
    .post('/api/v1/imports')
    .field('instrument_id', env.lab.foundry.id)
    .field('method_id', env.lab.feMethod.id)
    .attach('file', Buffer.from(csv), 'values.csv');
}

/** The cause after "Sample …, burn …, El: " or "Line …, column: ". */
const causeOf = (message: string) => message.replace(/^(Sample [^,]+, burn \d+, \w+|Line \d+, [^:]+): /, '').replace(/\.$/, '');

const REFUSED: { name: string; value: unknown; unit?: string; header: string; cell: string; cause: RegExp }[] = [
  { name: '150 as a string in %', value: '150', header: 'Ni %', cell: '150', cause: /^150 % is above 100 %$/ },
  { name: '150.5 as a number in %', value: 150.5, header: 'Ni %', cell: '150.5', cause: /^150\.5 % is above 100 %$/ },
  { name: '1e308', value: 1e308, header: 'Ni %', cell: '1e+308', cause: /^1e\+308 is above 100 % in any unit$/ },
  { name: '"1e999999999"', value: '1e999999999', header: 'Ni %', cell: '1e999999999', cause: /^1e999999999 is above 100 % in any unit$/ },
  { name: '1,000,001 ppm', value: 1000001, unit: 'ppm', header: 'Ni ppm', cell: '1000001', cause: /^1000001 ppm is above 100 %$/ },
  { name: 'a negative value', value: -0.002, header: 'Ni %', cell: '-0.002', cause: /^-0\.002 is negative; a mass fraction cannot be$/ },
  { name: '"NaN"', value: 'NaN', header: 'Ni %', cell: 'NaN', cause: /is not a number/ },
  { name: '">150"', value: '>150', header: 'Ni %', cell: '>150', cause: /^>150 % is above 100 %$/ },
];

describe('values refused the same way everywhere', () => {
  it.each(REFUSED)('$name: a push is a 400 naming sample, burn and element; a file names line and column; the same cause', async (c) => {
    const before = await countRows(env.t.db('samples'));
    const pushed = await env.agent.post('/api/v1/samples').send(sample('VR-1', { Ni: c.value }, c.unit));
    expectProblem(pushed, 400);
    const [pushError] = problemBody(pushed).errors!;
    expect(pushError.location).toBe('body.burns.1.values.Ni');
    expect(pushError.message.startsWith('Sample VR-1, burn 2, Ni: ')).toBe(true);
    expect(causeOf(pushError.message)).toMatch(c.cause);

    const batch = await env.agent
      .post('/api/v1/samples/batch')
      .send({ samples: [sample('VR-2', {}), sample('VR-3', { Ni: c.value }, c.unit)] });
    expectProblem(batch, 400);
    expect(problemBody(batch).errors!.map((e) => e.message)).toEqual([pushError.message.replace('VR-1', 'VR-3')]);

    const imported = await upload(`Sample,Mn %,${c.header}\nVR-4,0.75,0.1\nVR-4,0.76,${c.cell}\n`);
    expectProblem(imported, 422);
    const [issue] = problemBody(imported).issues as { line: number; column: string; message: string }[];
    expect(issue).toMatchObject({ line: 3, column: c.header });
    expect(causeOf(issue.message)).toBe(causeOf(pushError.message));
    expect(await countRows(env.t.db('samples'))).toBe(before);
  });

  it('accepts exactly 100 % and 1,000,000 ppm', async () => {
    expect((await env.agent.post('/api/v1/samples').send(sample('VR-5', { Fe: '100' }))).status).toBe(201);
    expect((await env.agent.post('/api/v1/samples').send(sample('VR-6', { Fe: 1000000, Mn: 7600 }, 'ppm'))).status).toBe(201);
  });
});

describe('the same unit spellings for a push as for a file header', () => {
  it.each([
    ['mg/kg', '5943', '0.5943'],
    ['ppm', '5943', '0.5943'],
    ['µg/kg', '12', '0.0000012'],
    ['ug/kg', '12', '0.0000012'],
    ['ppb', '12', '0.0000012'],
    ['fraction', '0.0075', '0.75'],
    ['%', '0.75', '0.75'],
  ])('%s: %s is %s %', async (unit, value, percent) => {
    const perPercent = { 'mg/kg': 1e4, ppm: 1e4, 'µg/kg': 1e7, 'ug/kg': 1e7, ppb: 1e7, fraction: 0.01, '%': 1 }[unit]!;
    expect(new Decimal(value).div(perPercent).toFixed()).toBe(percent);
    const res = await env.agent.post('/api/v1/samples').send({
      sample_code: `VU-${unit}`,
      instrument_id: env.lab.foundry.id,
      method_id: env.lab.feMethod.id,
      unit,
      burns: [{ values: { Si: value } }],
    });
    expect(res.status).toBe(201);
    const burn = (await env.agent.get(`/api/v1/samples/${res.body.id}`)).body.burns[0];
    expect(burn.values.Si).toMatchObject({ value: Number(percent), raw: value });
  });

  it('names the accepted spellings when a unit is unknown', async () => {
    const res = await env.agent.post('/api/v1/samples').send({ ...sample('VU-bad', {}), unit: 'furlongs' });
    expectProblem(res, 400);
    expect(problemBody(res).errors![0]).toMatchObject({ location: 'body.unit' });
    expect(problemBody(res).errors![0].message).toContain('mg/kg');
  });
});
