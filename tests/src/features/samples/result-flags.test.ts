import { describe, expect, it } from 'vitest';
import { RESULT_FLAGS } from '../../../../server/domain/chemistry/result-rules.ts';
import { flagInfo, RESULT_FLAG_DESCRIPTIONS, RESULT_FLAG_NAMES } from '../../../../src/features/samples/result-flags.ts';

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
    expect(flagInfo('repeatability_exceeded')).toMatchObject({ label: 'Repeatability exceeded', tone: 'attention' });
  });

  it('show a flag from a newer server by its name, asking for attention', () => {
    expect(flagInfo('drift_correction_stale')).toEqual({
      name: 'drift_correction_stale',
      label: 'drift correction stale',
      tone: 'attention',
      description: null,
    });
  });
});
