// The label of a sample's custom field (`furnace`, `cast_station`): the lab's own definition
// (GET /sample-fields), else the key in words ("cast_station" → "Cast station").
import type { SampleField } from '../../api/lookups.ts';

/** "cast_station" → "Cast station"; a key that already reads as words ("Furnace") is kept. */
export function keyInWords(key: string): string {
  const words = key.replace(/[_-]+/g, ' ').replace(/\s+/g, ' ').trim();
  return words ? words[0].toUpperCase() + words.slice(1) : key;
}

export interface FieldLabel {
  label: string;
  description: string | null;
}

/** The label of each key, and the lab's order of them (defined fields first, in their order; the rest by key). */
export function fieldLabels(definitions: readonly SampleField[] | undefined) {
  const defined = new Map((definitions ?? []).map((d, position) => [d.key, { ...d, position }]));
  return {
    labelOf: (key: string): FieldLabel => {
      const d = defined.get(key);
      return d ? { label: d.label, description: d.description } : { label: keyInWords(key), description: null };
    },
    order: (keys: string[]) =>
      [...keys].sort((a, b) => (defined.get(a)?.position ?? Infinity) - (defined.get(b)?.position ?? Infinity) || a.localeCompare(b)),
  };
}
