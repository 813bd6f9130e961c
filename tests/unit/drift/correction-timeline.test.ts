// Which set applies to a burn: the activated set with the latest effective_from at or before the
// burn's measurement time; the later activation wins a tie. (Our rule; no outside source.)
import { describe, expect, it } from 'vitest';
import { CorrectionTimeline, correctBurn, ingestCorrection } from '../../../server/domain/drift/correction-timeline.ts';

const set = (id: string, effective_from: string, slope = '1.1') => ({
  id,
  effective_from,
  corrections_json: JSON.stringify([
    { element: 'Mn', slope, offset: '0', flag: 'ok', reasons: [], levels: [], previous_slope: null, previous_offset: null },
    { element: 'B', slope: null, offset: null, flag: 'warn', reasons: ['…'], levels: [], previous_slope: null, previous_offset: null },
  ]),
});

describe('CorrectionTimeline', () => {
  const timeline = new CorrectionTimeline([
    set('std_a', '2026-03-01T06:00:00.000Z'),
    set('std_b', '2026-03-02T06:00:00.000Z'),
    set('std_c', '2026-03-02T06:00:00.000Z'),
    set('std_d', '2026-03-05T06:00:00.000Z'),
  ]);

  it('selects by measurement time, boundary included, later activation first on a tie', () => {
    expect(timeline.at('2026-03-01T05:59:59.999Z')).toBeNull();
    expect(timeline.at('2026-03-01T06:00:00.000Z')?.id).toBe('std_a');
    expect(timeline.at('2026-03-02T05:59:59.999Z')?.id).toBe('std_a');
    expect(timeline.at('2026-03-02T06:00:00.000Z')?.id).toBe('std_c');
    expect(timeline.at('2026-03-04T23:00:00+02:00')?.id).toBe('std_c');
    expect(timeline.at('2026-03-09T00:00:00.000Z')?.id).toBe('std_d');
  });

  it('corrects the elements the set covers and copies the others', () => {
    const burn = correctBurn(
      { Mn: { v: '0.7', q: null }, B: { v: '0.0004', q: null }, S: { v: null, q: 'nd' } },
      timeline.at('2026-03-03T00:00:00Z'),
    );
    expect(burn).toEqual({
      correction_set_id: 'std_c',
      corrected: { Mn: { v: '0.77', q: null }, B: { v: '0.0004', q: null }, S: { v: null, q: 'nd' } },
    });
    expect(correctBurn({ Mn: { v: '0.7', q: null } }, null)).toEqual({ correction_set_id: null, corrected: null });
  });

  it("records every set a sample's burns used, and nothing when none applied", () => {
    const a = correctBurn({ Mn: { v: '0.7', q: null } }, timeline.at('2026-03-01T12:00:00Z'));
    const c = correctBurn({ Mn: { v: '0.7', q: null } }, timeline.at('2026-03-02T12:00:00Z'));
    expect(ingestCorrection([a, c, c])).toEqual({
      applied_to: 'concentration',
      set_ids: ['std_a', 'std_c'],
      selection: 'measurement_time',
      reason: null,
      recomputed_by: null,
      recomputed_at: null,
    });
    expect(ingestCorrection([correctBurn({}, null)])).toBeNull();
  });
});
