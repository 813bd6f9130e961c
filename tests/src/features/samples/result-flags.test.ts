import { describe, expect, it } from 'vitest';
import { RESULT_FLAGS } from '../../../../server/domain/chemistry/result-rules.ts';
import {
  byTone,
  flagInfo,
  needsAttention,
  RESULT_FLAG_DESCRIPTIONS,
  RESULT_FLAG_NAMES,
} from '../../../../src/features/samples/result-flags.ts';

describe('result flags in the console', () => {
  it("are the server's list as the OpenAPI document carries it: same names, same order, same words", () => {
    expect(RESULT_FLAG_DESCRIPTIONS).toEqual(RESULT_FLAGS);
    expect(RESULT_FLAG_NAMES).toEqual(Object.keys(RESULT_FLAGS));
  });

  it('give every known flag a short label and its full meaning', () => {
    for (const name of RESULT_FLAG_NAMES) {
      const info = flagInfo(name);
      expect(info.label.length).toBeGreaterThan(0);
      expect(info.label).not.toContain('_');
      expect(info.description).toBe(RESULT_FLAGS[name]);
    }
    expect(flagInfo('repeatability_exceeded')).toMatchObject({ label: 'Burns disagree (repeatability exceeded)', tone: 'problem' });
  });

  it('never say "qualified" (it reads as "approved" in a lab) and keep a normal "<" trace element quiet', () => {
    for (const name of RESULT_FLAG_NAMES) expect(flagInfo(name).label.toLowerCase()).not.toContain('qualified');
    // Pb <0.002 % on aluminium: under the working range in every burn, reported as "<" — normal, not attention.
    for (const name of ['below_working_range', 'below_detection_limit', 'all_burns_qualified', 'not_detected', 'balance_by_difference'])
      expect(needsAttention(name)).toBe(false);
    for (const name of [
      'repeatability_exceeded',
      'mixed_qualified_burns',
      'above_working_range',
      'negative_after_correction',
      'sum_above_100',
    ])
      expect(needsAttention(name)).toBe(true);
  });

  it('sort problems before checks before notes', () => {
    expect(['below_working_range', 'single_burn', 'repeatability_exceeded'].sort(byTone)).toEqual([
      'repeatability_exceeded',
      'single_burn',
      'below_working_range',
    ]);
  });

  it('show a flag from a newer server by its name, asking for a check', () => {
    expect(flagInfo('drift_correction_stale')).toEqual({
      name: 'drift_correction_stale',
      label: 'drift correction stale',
      tone: 'check',
      description: null,
    });
  });
});
