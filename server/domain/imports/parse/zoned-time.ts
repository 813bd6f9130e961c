// Wall-clock times in an IANA time zone ("Europe/Berlin") → UTC, with the two hours a year where
// that is not one-to-one: a time the clocks skip when they go forward does not exist; a time in
// the hour repeated when they go back exists twice (the first, summer-time one is taken). The
// zone rules come from the ICU data in Node.js (Intl), never from a fixed offset.

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' });
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

/** Whether Node.js knows the name as an IANA time zone. */
export function isTimeZone(name: string): boolean {
  try {
    formatterFor(name);
    return true;
  } catch {
    return false;
  }
}

/** The zone's offset from UTC at an instant, in minutes east ("GMT+01:00" → 60). */
export function offsetAt(utcMillis: number, timeZone: string): number {
  const name = formatterFor(timeZone)
    .formatToParts(new Date(utcMillis))
    .find((part) => part.type === 'timeZoneName')!.value;
  const m = /^GMT(?:([+-])(\d{2}):(\d{2}))?$/.exec(name);
  if (!m || !m[1]) return 0;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
}

export type ZonedResult = { utcMillis: number; ambiguous: boolean } | { skipped: true };

const DAY = 86_400_000;

/**
 * `wallMillis`: the wall-clock reading as if it were UTC (Date.UTC of its fields). The offsets a
 * day before and after cover every change of offset near it; each candidate instant is kept only
 * if the zone really shows that wall clock then.
 */
export function wallClockToUtc(wallMillis: number, timeZone: string): ZonedResult {
  const offsets = new Set([offsetAt(wallMillis - DAY, timeZone), offsetAt(wallMillis + DAY, timeZone), offsetAt(wallMillis, timeZone)]);
  const instants = [...offsets]
    .map((offset) => wallMillis - offset * 60_000)
    .filter((instant) => instant + offsetAt(instant, timeZone) * 60_000 === wallMillis)
    .sort((a, b) => a - b);
  const unique = [...new Set(instants)];
  if (unique.length === 0) return { skipped: true };
  return { utcMillis: unique[0], ambiguous: unique.length > 1 };
}
