// Times in the reader's own zone, with the zone named, for schedules such as a webhook's next retry.
const FORMAT = new Intl.DateTimeFormat(undefined, {
  year: 'numeric',
  month: '2-digit',
  day: '2-digit',
  hour: '2-digit',
  minute: '2-digit',
  second: '2-digit',
  timeZoneName: 'short',
});

/** "03/12/2026, 07:15:02 CET" (in the browser's locale and zone) from an ISO instant; "—" without one. */
export function localDateTime(iso: string | null | undefined): string {
  return iso ? FORMAT.format(new Date(iso)) : '—';
}

/** The browser's zone, e.g. "Europe/Berlin", for labels next to a datetime-local input. */
export function localZoneName(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone;
}

/** The value of a datetime-local input ("2026-12-03T06:00") as an ISO instant, read in the local zone. */
export function localInputToIso(value: string): string | null {
  const date = new Date(value);
  return value && !Number.isNaN(date.getTime()) ? date.toISOString() : null;
}

/** A datetime-local input value for an instant, in the local zone. */
export function isoToLocalInput(date: Date): string {
  const local = new Date(date.getTime() - date.getTimezoneOffset() * 60_000);
  return local.toISOString().slice(0, 16);
}
