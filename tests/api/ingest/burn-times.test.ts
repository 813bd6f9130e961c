// Burn times: a time in the future (beyond 5 minutes of clock skew) is refused on every way in;
// an import profile names the instrument's IANA time zone and naive times are read in it (daylight
// saving included: a skipped time is refused, a repeated one read as its first occurrence with a
// warning); without a zone, naive times within an hour of a correction set's start are refused;
// the import report says which zone it used. Zone rules: docs/references.md, "Time zones".
import { describe, expect, it } from 'vitest';
import { expectProblem, problemBody } from '../../helpers/test-app.ts';
import { activate, burnsAt, createRun, twoPointRun, useDriftSetup } from '../drift/drift-setup.ts';

const s = useDriftSetup();

const minutesFromNow = (m: number) => new Date(Date.now() + m * 60_000);
/** "YYYY-MM-DD HH:mm" of an instant read in UTC: a time without offset. */
const naiveUtc = (date: Date) => date.toISOString().slice(0, 16).replace('T', ' ');

function push(measuredAt: string, code = 'BT-1') {
  return s.analyst.post('/api/v1/samples').send({
    sample_code: code,
    instrument_id: s.lab.foundry.id,
    method_id: s.method.id,
    burns: [{ values: { C: 0.2 } }, { measured_at: measuredAt, values: { C: 0.21 } }],
  });
}

function upload(csv: string, profileId?: string) {
  const req = s.analyst
    .post('/api/v1/imports')
    .field('instrument_id', s.lab.foundry.id)
    .field('method_id', s.method.id)
    .field('mode', 'per_sample');
  if (profileId) req.field('profile_id', profileId);
  return req.attach('file', Buffer.from(csv), 'times.csv');
}

async function profile(time: Record<string, unknown>) {
  const res = await s.analyst.post('/api/v1/import-profiles').send({ name: `times ${JSON.stringify(time)}`, time });
  return res;
}

describe('burns measured in the future', () => {
  it('a push is a 400 naming sample and burn; two minutes ahead (clock skew) is accepted', async () => {
    const refused = await push(minutesFromNow(60).toISOString());
    expectProblem(refused, 400);
    expect(problemBody(refused).errors).toEqual([
      expect.objectContaining({
        location: 'body.burns.1.measured_at',
        code: 'future_time',
        message: expect.stringMatching(/^Sample BT-1, burn 2: measured_at .* is in the future/),
      }),
    ]);
    expect((await push(minutesFromNow(2).toISOString(), 'BT-2')).status).toBe(201);
  });

  it('a file line is refused with its line and column', async () => {
    const future = minutesFromNow(120).toISOString();
    const res = await upload(`Sample,Time,C\nBT-3,${future},0.2\nBT-4,${minutesFromNow(-60).toISOString()},0.2\n`);
    expect(res.status).toBe(201);
    expect(res.body.report.rejected).toEqual([expect.objectContaining({ line: 2, column: 'Time', code: 'future_time' })]);
    expect(res.body.report.counts.samples_created).toBe(1);
  });
});

describe('time zones of import profiles', () => {
  it('refuses an unknown zone, and a zone together with an offset', async () => {
    const unknown = await profile({ time_zone: 'Mars/Olympus' });
    expectProblem(unknown, 400);
    expect(problemBody(unknown).errors![0]).toMatchObject({ location: 'body.time.time_zone' });
    const both = await profile({ time_zone: 'Europe/Berlin', utc_offset: '+01:00' });
    expectProblem(both, 400);
    expect(problemBody(both).errors![0]).toMatchObject({ location: 'body.time.utc_offset', message: expect.stringContaining('not both') });
  });

  it('reads naive times in the zone, summer and winter; refuses a skipped time; warns on a repeated one; the report names the zone', async () => {
    const created = await profile({ time_zone: 'Europe/Berlin' });
    expect(created.status).toBe(201);
    expect(created.body.time).toEqual({ format: 'auto', time_zone: 'Europe/Berlin', utc_offset: null });
    const csv = [
      'Sample,Time,C',
      'BZ-1,2026-01-15 08:00,0.2', // CET, UTC+1
      'BZ-2,2026-07-15 08:00,0.2', // CEST, UTC+2
      'BZ-3,2026-03-29 02:30,0.2', // skipped: clocks go from 02:00 to 03:00
      'BZ-4,2026-10-25 02:30,0.2', // repeated: first (CEST) occurrence
      '',
    ].join('\n');
    const res = await upload(csv, created.body.id);
    expect(res.status).toBe(201);
    expect(res.body.report.layout.time_zone).toBe('Europe/Berlin');
    expect(res.body.report.rejected).toEqual([
      expect.objectContaining({ line: 4, code: 'invalid_time', message: expect.stringContaining('does not exist in Europe/Berlin') }),
    ]);
    expect(res.body.report.warnings).toEqual([expect.objectContaining({ code: 'ambiguous_time', line: 5 })]);
    const times: Record<string, string> = {};
    for (const id of res.body.report.sample_ids) {
      const sample = (await s.analyst.get(`/api/v1/samples/${id}`)).body;
      times[sample.sample_code] = sample.burns[0].measured_at;
    }
    expect(times).toEqual({ 'BZ-1': '2026-01-15T07:00:00.000Z', 'BZ-2': '2026-07-15T06:00:00.000Z', 'BZ-4': '2026-10-25T00:30:00.000Z' });
  });

  it('without a zone, refuses naive times within an hour of a correction set coming into force, and reads the others as UTC with a warning', async () => {
    const run = await createRun(
      s,
      twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1), { measured_at: minutesFromNow(-10).toISOString() }),
    );
    const activated = await activate(s, run.id);
    const start = Date.parse(activated.activation.effective_from);
    const near = naiveUtc(new Date(start - 30 * 60_000));
    const far = naiveUtc(new Date(start - 3 * 3600_000));
    const res = await upload(`Sample,Time,C\nBN-1,${near},0.2\nBN-2,${far},0.2\n`);
    expect(res.status).toBe(201);
    expect(res.body.report.layout.time_zone).toBe('UTC');
    expect(res.body.report.rejected).toEqual([
      expect.objectContaining({ line: 2, column: 'Time', code: 'time_zone_needed', message: expect.stringContaining('time.time_zone') }),
    ]);
    expect(res.body.report.warnings).toEqual([expect.objectContaining({ code: 'time_without_offset' })]);
    expect(res.body.report.counts.samples_created).toBe(1);

    // All or nothing: the whole file is refused, naming the line.
    const strict = await s.analyst
      .post('/api/v1/imports')
      .field('instrument_id', s.lab.foundry.id)
      .field('method_id', s.method.id)
      .attach('file', Buffer.from(`Sample,Time,C\nBN-3,${near},0.2\n`), 'strict.csv');
    expectProblem(strict, 422);
    expect(problemBody(strict).issues).toEqual([expect.objectContaining({ line: 2, code: 'time_zone_needed' })]);

    // With the zone named, the same time is read in it and accepted.
    const utc = await profile({ time_zone: 'UTC' });
    const named = await upload(`Sample,Time,C\nBN-4,${near},0.2\n`, utc.body.id);
    expect(named.body.report).toMatchObject({ rejected: [], counts: { samples_created: 1 }, layout: { time_zone: 'UTC' } });
  });
});
