// The label of a sample's custom field (`furnace`, `cast_station`): the header the lab gave that
// field in its import profiles (columns.fields: key → header), else the key in words
// ("cast_station" → "Cast station"). Profiles are read in name order, so the label is stable.
import type { ImportProfile } from '../../api/lookups.ts';

/** "cast_station" → "Cast station"; a key that already reads as words ("Furnace") is kept. */
export function keyInWords(key: string): string {
  const words = key.replace(/[_-]+/g, ' ').replace(/\s+/g, ' ').trim();
  return words ? words[0].toUpperCase() + words.slice(1) : key;
}

export function fieldLabels(profiles: readonly ImportProfile[] | undefined): (key: string) => string {
  const labels = new Map<string, string>();
  for (const profile of [...(profiles ?? [])].sort((a, b) => a.name.localeCompare(b.name)))
    for (const [key, header] of Object.entries(profile.columns?.fields ?? {})) if (!labels.has(key) && header) labels.set(key, header);
  return (key) => labels.get(key) ?? keyInWords(key);
}
