// Element columns that are often misread are named before import (preview) and in the report,
// and an import profile's per-column decisions (ignore, map to an element or a field, keep) are
// honoured by the import. The report counts result flags per element.
// Why these columns are doubtful: docs/references.md#import-column-review.
import { describe, expect, it } from 'vitest';
import { expectProblem, problemBody, useDemoLab } from '../../helpers/test-app.ts';

const state = useDemoLab();

// Invented values (Kestrel Bend). "CE %" is a carbon equivalent as a spark stand prints it;
// "Fe %" is the balance; Co is not listed by the demo's FE-LA method.
const AMBIGUOUS = [
  'Sample,Heat,Burn,C %,Mn %,CE %,Fe %,Co %',
  'K24-0810-F1,K24-0810,1,0.452,0.75,0.58,98.10,0.004',
  'K24-0810-F1,K24-0810,2,0.448,0.76,0.57,98.11,0.005',
  'K24-0811-F1,K24-0811,1,0.20,0.80,0.34,98.60,0.003',
  '',
].join('\n');

function send(path: 'preview' | 'commit', csv: string, fields: { method?: string; profile?: string } = {}) {
  const { agent, lab } = state;
  const req = agent
    .post(path === 'preview' ? '/api/v1/imports/preview' : '/api/v1/imports')
    .field('instrument_id', lab.foundry.id)
    .field('method_id', fields.method ?? lab.feMethod.id);
  if (fields.profile) req.field('profile_id', fields.profile);
  return req.attach('file', Buffer.from(csv), 'ambiguous.csv');
}

type Column = { header: string; role: string; element?: string; field?: string; kept?: boolean; attention?: { code: string } };
const attentionOf = (columns: Column[]) => Object.fromEntries(columns.map((c) => [c.header, c.attention?.code ?? null]));

describe('columns that need a decision', () => {
  it('the preview names CE as a computed index, Fe as the balance and Co as outside the method, with warnings', async () => {
    const res = await send('preview', AMBIGUOUS);
    expect(res.status).toBe(200);
    expect(attentionOf(res.body.layout.columns)).toEqual({
      Sample: null,
      Heat: null,
      Burn: null,
      'C %': null,
      'Mn %': null,
      'CE %': 'computed_index',
      'Fe %': 'balance_element',
      'Co %': 'not_in_method',
    });
    const ce = (res.body.layout.columns as Column[]).find((c) => c.header === 'CE %')!;
    expect(ce).toMatchObject({ role: 'element', element: 'Ce', source: 'auto' });
    const warnings = res.body.warnings as { column: string; code: string; line: number; message: string }[];
    expect(warnings.filter((w) => ['computed_index', 'balance_element', 'not_in_method'].includes(w.code))).toEqual([
      expect.objectContaining({ line: 1, column: 'CE %', code: 'computed_index' }),
      expect.objectContaining({ line: 1, column: 'Fe %', code: 'balance_element' }),
      expect.objectContaining({ line: 1, column: 'Co %', code: 'not_in_method' }),
    ]);
    expect(warnings.find((w) => w.code === 'computed_index')!.message).toContain('carbon equivalent');
  });

  it('"Ce" written as cerium is only outside the method, and a balance reported by difference says so', async () => {
    const { lab } = state;
    const steel = await send('preview', 'Sample,C %,Ce %\nK24-0812-F1,0.45,0.010\n');
    expect(attentionOf(steel.body.layout.columns)['Ce %']).toBe('not_in_method');
    const aluminium = await send('preview', 'Sample,Si %,Al %\nK24-A0813,0.45,99.20\n', { method: lab.alMethod.id });
    expect(attentionOf(aluminium.body.layout.columns)['Al %']).toBe('balance_element');
    expect((aluminium.body.warnings as { code: string; message: string }[]).find((w) => w.code === 'balance_element')!.message).toContain(
      'reports Al by difference',
    );
  });

  it('an import without decisions still names the columns in its report', async () => {
    const res = await send('commit', AMBIGUOUS.replaceAll('K24-081', 'K24-082'));
    expect(res.status).toBe(201);
    expect((res.body.report.warnings as { code: string }[]).map((w) => w.code)).toEqual(
      expect.arrayContaining(['computed_index', 'balance_element', 'not_in_method']),
    );
    const sample = await state.agent.get(`/api/v1/samples/${res.body.report.sample_ids[0]}`);
    expect(sample.body.results.map((r: { element: string }) => r.element)).toContain('Ce');
  });
});

describe('decisions saved in an import profile', () => {
  it('ignore, map to a field and keep: the preview is quiet and the import stores what was decided', async () => {
    const profile = await state.agent.post('/api/v1/import-profiles').send({
      name: 'OES-1 with carbon equivalent',
      columns: { fields: { carbon_equivalent: 'CE %' } },
      ignore_columns: ['Co %'],
      keep_columns: ['Fe %'],
    });
    expect(profile.status).toBe(201);
    expect(profile.body.keep_columns).toEqual(['Fe %']);

    const preview = await send('preview', AMBIGUOUS.replaceAll('K24-081', 'K24-083'), { profile: profile.body.id });
    expect(preview.status).toBe(200);
    const columns = preview.body.layout.columns as Column[];
    expect(columns.filter((c) => c.attention)).toEqual([]);
    expect(columns.find((c) => c.header === 'CE %')).toMatchObject({ role: 'field', field: 'carbon_equivalent', source: 'profile' });
    expect(columns.find((c) => c.header === 'Co %')).toMatchObject({ role: 'ignored', source: 'profile' });
    expect(columns.find((c) => c.header === 'Fe %')).toMatchObject({ role: 'element', element: 'Fe', kept: true, source: 'auto' });
    expect((preview.body.warnings as { code: string }[]).map((w) => w.code)).not.toContain('not_in_method');

    const imported = await send('commit', AMBIGUOUS.replaceAll('K24-081', 'K24-083'), { profile: profile.body.id });
    expect(imported.status).toBe(201);
    const sample = await state.agent.get(`/api/v1/samples/${imported.body.report.sample_ids[0]}`);
    const elements = sample.body.results.map((r: { element: string }) => r.element);
    expect(elements).not.toContain('Ce');
    expect(elements).not.toContain('Co');
    expect(elements).toContain('Fe');
    expect(sample.body.fields).toMatchObject({ carbon_equivalent: '0.58' });
  });

  it('adds decisions to a profile saved before keep_columns existed (PATCH), bumping its revision', async () => {
    const created = await state.agent.post('/api/v1/import-profiles').send({ name: 'Older profile', ignore_columns: ['CE %'] });
    const row = await state.t.db('import_profiles').where({ id: created.body.id }).first();
    const { keep_columns: _dropped, ...older } = JSON.parse(row.definition_json);
    await state.t
      .db('import_profiles')
      .where({ id: created.body.id })
      .update({ definition_json: JSON.stringify(older) });
    const fetched = await state.agent.get(`/api/v1/import-profiles/${created.body.id}`);
    expect(fetched.body.keep_columns).toEqual([]);

    const changed = await state.agent
      .patch(`/api/v1/import-profiles/${created.body.id}`)
      .send({ ignore_columns: ['CE %', 'Fe %'], keep_columns: ['Co %'] });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ revision: 2, ignore_columns: ['CE %', 'Fe %'], keep_columns: ['Co %'] });
    const preview = await send('preview', AMBIGUOUS, { profile: created.body.id });
    expect((preview.body.layout.columns as Column[]).filter((c) => c.attention)).toEqual([]);
  });

  it('maps a column to another element', async () => {
    const profile = await state.agent.post('/api/v1/import-profiles').send({
      name: 'Cobalt column is really chromium',
      element_columns: [{ header: 'Co %', element: 'Cr' }],
      ignore_columns: ['CE %', 'Fe %'],
    });
    expect(profile.status).toBe(201);
    const preview = await send('preview', AMBIGUOUS, { profile: profile.body.id });
    expect((preview.body.layout.columns as Column[]).find((c) => c.header === 'Co %')).toMatchObject({ element: 'Cr', source: 'profile' });
    expect(preview.body.samples[0].burns[0].values).toEqual({ C: '0.452', Mn: '0.75', Cr: '0.004' });
  });

  it('refuses a header both kept and ignored (400), and a kept header the file lacks (422)', async () => {
    const clash = await state.agent
      .post('/api/v1/import-profiles')
      .send({ name: 'Contradiction', ignore_columns: ['Fe %'], keep_columns: ['fe %'] });
    expectProblem(clash, 400);
    expect(problemBody(clash).errors).toEqual([expect.objectContaining({ location: 'body.keep_columns.0' })]);

    const profile = await state.agent.post('/api/v1/import-profiles').send({ name: 'Keeps Ni', keep_columns: ['Ni %'] });
    const res = await send('preview', AMBIGUOUS, { profile: profile.body.id });
    expectProblem(res, 422);
    expect(problemBody(res).errors).toEqual([expect.objectContaining({ code: 'missing_column' })]);
  });
});

describe('flag summary of the import report', () => {
  it('counts, per element, how many created samples carry each flag', async () => {
    const profile = await state.agent.post('/api/v1/import-profiles').send({
      name: 'Summary test',
      ignore_columns: ['CE %', 'Co %'],
      keep_columns: ['Fe %'],
    });
    const res = await send('commit', AMBIGUOUS.replaceAll('K24-081', 'K24-084'), { profile: profile.body.id });
    expect(res.status).toBe(201);
    const summary = res.body.report.flag_summary as { element: string | null; flag: string; samples: number }[];
    // One of the two samples has a single burn: every element of it is flagged single_burn.
    for (const element of ['C', 'Mn', 'Fe']) expect(summary).toContainEqual({ element, flag: 'single_burn', samples: 1 });
    // Fe is not listed by FE-LA: both samples carry not_in_method on Fe.
    expect(summary).toContainEqual({ element: 'Fe', flag: 'not_in_method', samples: 2 });
    // Method order (C before Mn), elements outside the method after.
    const order = [...new Set(summary.map((row) => row.element))];
    expect(order.indexOf('C')).toBeLessThan(order.indexOf('Mn'));
    expect(order.indexOf('Mn')).toBeLessThan(order.indexOf('Fe'));
    // Cross-check with the samples themselves.
    const flagged = await Promise.all(
      (res.body.report.sample_ids as string[]).map(async (id) => (await state.agent.get(`/api/v1/samples/${id}`)).body),
    );
    const mnSingle = flagged.filter((s) => s.results.find((r: { element: string }) => r.element === 'Mn').flags.includes('single_burn'));
    expect(mnSingle).toHaveLength(1);
  });
});
