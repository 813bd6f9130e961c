// From the samples of a read file and the reference material chosen for each, to the references
// of a run: every sample mapped to the same reference adds its burns (a reference sparked in two
// sessions of the same file), and the run's measurement time is the latest of their burns.
import type { StandardizationFileReading } from './api/standardization-file.ts';
import type { BurnRow } from './burns-grid.ts';

export interface MappedReference {
  referenceId: string;
  rows: BurnRow[];
}

/** The reference each sample's code matched (or '' to choose one). */
export function initialMapping(reading: StandardizationFileReading): string[] {
  return reading.samples.map((s) => s.reference_material?.id ?? '');
}

/** The mapped references in the order their first sample appears in the file. */
export function mappedReferences(reading: StandardizationFileReading, mapping: readonly string[]): MappedReference[] {
  const found = new Map<string, BurnRow[]>();
  reading.samples.forEach((sample, i) => {
    const id = mapping[i];
    if (!id) return;
    found.set(id, [...(found.get(id) ?? []), ...sample.burns.map((b) => ({ ...b.values }))]);
  });
  return [...found].map(([referenceId, rows]) => ({ referenceId, rows }));
}

/** The latest burn time of the samples mapped to a reference, ISO; null when the file gives none. */
export function mappedMeasuredAt(reading: StandardizationFileReading, mapping: readonly string[]): string | null {
  return reading.samples.reduce<string | null>(
    (latest, s, i) => (mapping[i] && s.measured_at && (!latest || s.measured_at > latest) ? s.measured_at : latest),
    null,
  );
}
