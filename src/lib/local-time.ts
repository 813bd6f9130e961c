// The reader's zone for labels of typed times. Showing instants is <Timestamp> / formatInstant.
import { formatInstant } from './timestamp.ts';

/** @deprecated Use <Timestamp seconds> or formatInstant(iso, { seconds: true }). */
export function localDateTime(iso: string | null | undefined): string {
  return formatInstant(iso, { seconds: true });
}

/** The browser's zone, e.g. "Europe/Berlin", for labels next to a datetime-local input. */
export function localZoneName(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone;
}

/** @deprecated Typed times are yyyy-mm-dd hh:mm text (DateTimeField, readIsoDateTime in src/lib/iso-date.ts). The value of a datetime-local input ("2026-12-03T06:00") as an ISO instant, read in the local zone. */
export function localInputToIso(value: string): string | null {
  const date = new Date(value);
  return value && !Number.isNaN(date.getTime()) ? date.toISOString() : null;
}

/** @deprecated Use toIsoDateTimeText (src/lib/iso-date.ts). A datetime-local input value for an instant, in the local zone. */
export function isoToLocalInput(date: Date): string {
  const local = new Date(date.getTime() - date.getTimezoneOffset() * 60_000);
  return local.toISOString().slice(0, 16);
}
