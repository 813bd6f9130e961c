import { describe, expect, it } from 'vitest';
import type { StandardizationFileReading } from '../../../../src/features/drift/api/standardization-file.ts';
import { initialMapping, mappedMeasuredAt, mappedReferences } from '../../../../src/features/drift/file-mapping.ts';
import { emptySlots, fillSlots } from '../../../../src/features/drift/run-slots.ts';

const sample = (code: string, referenceId: string | null, at: string, c: string) => ({
  sample_code: code,
  first_line: 2,
  measured_at: at,
  reference_material: referenceId ? { id: referenceId, code, name: code, kind: 'high' as const } : null,
  burns: [{ line: 2, burn_number: 1, measured_at: at, values: { C: c } }],
  rejected: 0,
});

const reading = {
  samples: [
    sample('LO-A', null, '2026-11-30T06:04:00.000Z', '0.106'),
    sample('KB-FE-HI', 'rm_hi', '2026-11-30T06:01:00.000Z', '0.82'),
    sample('LO-B', null, '2026-11-30T06:07:00.000Z', '0.107'),
    sample('K24-0412-F1', null, '2026-11-30T06:09:00.000Z', '0.41'),
  ],
} as unknown as StandardizationFileReading;

const kinds: Record<string, 'high' | 'low' | 'type'> = { rm_hi: 'high', rm_lo: 'low', rm_type: 'type' };

describe('references from a read file', () => {
  it('joins the burns of samples mapped to one reference and takes the latest burn of the mapped samples', () => {
    const mapping = initialMapping(reading);
    expect(mapping).toEqual(['', 'rm_hi', '', '']);
    const chosen = ['rm_lo', 'rm_hi', 'rm_lo', ''];
    expect(mappedReferences(reading, chosen)).toEqual([
      { referenceId: 'rm_lo', rows: [{ C: '0.106' }, { C: '0.107' }] },
      { referenceId: 'rm_hi', rows: [{ C: '0.82' }] },
    ]);
    // The production sample sparked last is left out, so its time does not count.
    expect(mappedMeasuredAt(reading, chosen)).toBe('2026-11-30T06:07:00.000Z');
  });

  it('fills the high and low slots of a two-point run in that order, whatever the file order', () => {
    const mapped = mappedReferences(reading, ['rm_lo', 'rm_hi', 'rm_lo', '']);
    const { mode, slots } = fillSlots(mapped, (id) => kinds[id], 'one_point_factor', emptySlots());
    expect(mode).toBe('two_point');
    expect(slots.map((s) => s.referenceId)).toEqual(['rm_hi', 'rm_lo']);
  });

  it('turns a lone type reference into a type run and keeps a slot nothing fits', () => {
    const mapped = mappedReferences(reading, ['rm_type', '', '', '']);
    const { mode, slots } = fillSlots(mapped, (id) => kinds[id], 'two_point', emptySlots());
    expect(mode).toBe('type');
    expect(slots[0]).toEqual({ referenceId: 'rm_type', rows: [{ C: '0.106' }] });
    expect(slots[1]).toEqual(emptySlots()[1]);
  });
});
