// Text in an imported file obeys the limits of a JSON push (SAMPLE_TEXT_LIMITS): a sample code,
// heat or grade over 100 characters, an identification field's name over 60 or value over 500,
// more than 30 fields, or an element cell over 40 characters is an issue naming line and column.
// All or nothing: 422, nothing stored. Per sample: that sample is left out, the others stored.
import { describe, expect, it } from 'vitest';
import { SAMPLE_TEXT_LIMITS } from '../../../server/domain/samples/sample-limits.ts';
import { countRows, expectProblem, problemBody, useDemoLab } from '../../helpers/test-app.ts';

const env = useDemoLab('analyst');

function upload(csv: string, mode: 'all_or_nothing' | 'per_sample' = 'all_or_nothing') {
  return env.agent
    .post('/api/v1/imports')
    .field('instrument_id', env.lab.foundry.id)
    .field('method_id', env.lab.feMethod.id)
    .field('mode', mode)
    .attach('file', Buffer.from(csv), 'results.csv');
}

function push(body: Record<string, unknown>) {
  return env.agent.post('/api/v1/samples').send({
    sample_code: 'K24-0990-F1',
    instrument_id: env.lab.foundry.id,
    method_id: env.lab.feMethod.id,
    burns: [{ values: { Mn: 0.75 } }],
    ...body,
  });
}

let counter = 0;
/** A file with a good sample before and after the line under test (line 3); `extra` = cells of the columns after Grade. */
function fileWith(columns: string, cells: string, extra = '1,0.75'): string {
  counter += 1;
  const good = (n: number) => `K24-${counter}${n}-F1,K24-${counter}${n},SAE 1045,${extra}`;
  return [`Sample,Heat,Grade,${columns}`, good(1), cells, good(2), ''].join('\n');
}

const long = (n: number) => 'x'.repeat(n);

describe('limits on imported text', () => {
  it('refuses a 100,000-character sample code with 422 naming line and column, and stores nothing', async () => {
    const before = await countRows(env.t.db('samples'));
    const res = await upload(fileWith('Burn,Mn %', `${long(100_000)},K24-0999,SAE 1045,1,0.75`));
    expectProblem(res, 422);
    expect(problemBody(res).issues).toEqual([
      {
        line: 3,
        column: 'Sample',
        code: 'too_long',
        message: 'Line 3, Sample: the sample code has 100000 characters, at most 100 are accepted.',
      },
    ]);
    expect(problemBody(res).errors?.[0].location).toBe('file:line 3:Sample');
    expect(await countRows(env.t.db('samples'))).toBe(before);
    expect(await countRows(env.t.db('samples').whereRaw('length(sample_code) > 100'))).toBe(0);
  });

  it('accepts exactly the limit and refuses one more, for sample code, heat and grade alike', async () => {
    const max = SAMPLE_TEXT_LIMITS.identification;
    expect((await upload(fileWith('Burn,Mn %', `${long(max)},${long(max)},${long(max)},1,0.75`))).status).toBe(201);
    for (const [cells, column] of [
      [`${long(max + 1)},K24-0998,SAE 1045,1,0.75`, 'Sample'],
      [`K24-0998-F1,${long(max + 1)},SAE 1045,1,0.75`, 'Heat'],
      [`K24-0998-F1,K24-0998,${long(max + 1)},1,0.75`, 'Grade'],
    ]) {
      const res = await upload(fileWith('Burn,Mn %', cells));
      expectProblem(res, 422);
      expect(problemBody(res).issues).toEqual([expect.objectContaining({ line: 3, column, code: 'too_long' })]);
    }
    // The same limit as a JSON push of the same sample.
    expectProblem(await push({ grade: long(max + 1) }), 400);
  });

  it('leaves out only the sample with a too-long field value in per-sample mode', async () => {
    const max = SAMPLE_TEXT_LIMITS.fieldValue;
    const csv = fileWith('Furnace,Burn,Mn %', `K24-0997-F1,K24-0997,SAE 1045,${long(max + 1)},1,0.75`, 'EAF-2,1,0.75');
    const res = await upload(csv, 'per_sample');
    expect(res.status).toBe(201);
    expect(res.body.report.counts).toMatchObject({ samples_created: 2, lines_rejected: 1 });
    expect(res.body.report.rejected).toEqual([
      {
        line: 3,
        column: 'Furnace',
        code: 'too_long',
        message: `Line 3, Furnace: the value has ${max + 1} characters, at most ${max} are accepted.`,
      },
    ]);
    expect(await countRows(env.t.db('samples').where({ sample_code: 'K24-0997-F1' }))).toBe(0);
    expectProblem(await push({ fields: { Furnace: long(max + 1) } }), 400);
  });

  it('rejects a sample with a later too-long line in per-sample mode, keeping its first line out too', async () => {
    const csv = [
      'Sample,Heat,Grade,Burn,Mn %',
      'K24-0996-F1,K24-0996,SAE 1045,1,0.75',
      `K24-0996-F1,K24-0996,${long(101)},2,0.76`,
      'K24-0995-F1,K24-0995,SAE 1045,1,0.80',
      '',
    ].join('\n');
    const res = await upload(csv, 'per_sample');
    expect(res.status).toBe(201);
    expect(res.body.report.counts).toMatchObject({ samples_created: 1, samples_rejected: 1, lines_rejected: 1 });
    expect(res.body.report.warnings).toEqual([]);
    expect(await countRows(env.t.db('samples').where({ sample_code: 'K24-0996-F1' }))).toBe(0);
  });

  it('refuses a too-long field name (a long header with a value), too many fields, and a too-long element cell', async () => {
    const header = `Furnace ${long(SAMPLE_TEXT_LIMITS.fieldName)}`;
    const named = await upload(fileWith(`${header},Burn,Mn %`, 'K24-0994-F1,K24-0994,SAE 1045,,1,0.75', 'EAF-2,1,0.75'));
    expectProblem(named, 422);
    // Only the lines that give the field a value would store its name.
    expect(problemBody(named).issues).toEqual([
      {
        line: 2,
        column: `${header.slice(0, 60)}…`,
        code: 'too_long',
        message: `Line 2, ${header.slice(0, 60)}…: the name of this identification field has ${header.length} characters, at most 60 are accepted.`,
      },
      expect.objectContaining({ line: 4, code: 'too_long' }),
    ]);

    const many = Array.from({ length: SAMPLE_TEXT_LIMITS.fields + 1 }, (_, i) => `F${i}`);
    const crowded = [`Sample,${many.join(',')},Mn %`, `K24-0993-F1,${many.map((_, i) => `v${i}`).join(',')},0.75`, ''].join('\n');
    const fields = await upload(crowded);
    expectProblem(fields, 422);
    expect(problemBody(fields).issues).toEqual([expect.objectContaining({ line: 2, code: 'too_many_fields' })]);

    const padded = `0.75${' '.repeat(SAMPLE_TEXT_LIMITS.value)}`;
    const cell = await upload(fileWith('Burn,Mn %', `K24-0992-F1,K24-0992,SAE 1045,1,${padded}`));
    expectProblem(cell, 422);
    expect(problemBody(cell).issues).toEqual([expect.objectContaining({ line: 3, column: 'Mn %', code: 'invalid_value' })]);
    expectProblem(await push({ burns: [{ values: { Mn: padded } }] }), 400);
  });
});
