// The console's one clock: instants arrive from the API as ISO 8601 UTC and are shown in the
// reader's own zone, written year-first (ISO 8601 order) whatever the browser's locale, with the
// zone named as its UTC offset. Zone abbreviations (CET, EST …) are left out on purpose: browsers
// know them only for some zones and locales, and several are ambiguous.

export interface InstantView {
  /** "2026-03-29 03:30" (with ":15" seconds when asked), in the zone below. */
  local: string;
  /** The offset in force at that instant: "UTC+2", "UTC+5:30", "UTC". */
  zone: string;
  /** The IANA zone the local time is in, e.g. "Europe/Berlin". */
  timeZone: string;
  /** "2026-03-29 01:30:00 UTC". */
  utc: string;
  /** "2026-03-29T01:30:00.000Z", for a <time dateTime> attribute. */
  iso: string;
}

export interface InstantOptions {
  /** An IANA zone; the browser's own zone when absent. */
  timeZone?: string;
  /** Show seconds in the local time (logs, deliveries); minutes otherwise. */
  seconds?: boolean;
}

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string | undefined): Intl.DateTimeFormat {
  const key = timeZone ?? '';
  let formatter = formatters.get(key);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
      hourCycle: 'h23',
      timeZoneName: 'shortOffset',
    });
    formatters.set(key, formatter);
  }
  return formatter;
}

/** "GMT+2" → "UTC+2"; "GMT" (no offset) → "UTC". */
function offsetLabel(gmtOffset: string): string {
  const offset = gmtOffset.replace(/^GMT/, '');
  return offset === '' || offset === '+0' ? 'UTC' : `UTC${offset}`;
}

function toDate(value: string | number | Date): Date | null {
  const date = value instanceof Date ? value : new Date(value);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** The parts of an instant the console shows; null for a missing or unreadable instant. */
export function viewInstant(value: string | number | Date | null | undefined, options: InstantOptions = {}): InstantView | null {
  if (value === null || value === undefined || value === '') return null;
  const date = toDate(value);
  if (!date) return null;
  const formatter = formatterFor(options.timeZone);
  const parts = Object.fromEntries(formatter.formatToParts(date).map((part) => [part.type, part.value]));
  const time = `${parts.hour}:${parts.minute}${options.seconds ? `:${parts.second}` : ''}`;
  const iso = date.toISOString();
  return {
    local: `${parts.year}-${parts.month}-${parts.day} ${time}`,
    zone: offsetLabel(parts.timeZoneName ?? 'GMT'),
    timeZone: formatter.resolvedOptions().timeZone,
    utc: `${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`,
    iso,
  };
}

/** One line of text for places that cannot hold the <Timestamp> element (chart tooltips, titles): "2026-03-29 03:30 UTC+2"; "—" without an instant. */
export function formatInstant(value: string | number | Date | null | undefined, options: InstantOptions = {}): string {
  const view = viewInstant(value, options);
  return view ? `${view.local} ${view.zone}` : '—';
}

/** The text shown on hover: the same instant in UTC and the zone it was converted to. */
export function instantTitle(view: InstantView): string {
  return `${view.utc} (shown in ${view.timeZone}, ${view.zone})`;
}

/** How long ago an instant was, in the largest whole unit: "45 min", "5 h", "3 d"; "in the future" for a later one. */
export function formatAge(value: string | number | Date, now: number = Date.now()): string {
  const date = toDate(value);
  if (!date) return '—';
  const minutes = Math.floor((now - date.getTime()) / 60_000);
  if (minutes < 0) return 'in the future';
  if (minutes < 60) return `${minutes} min`;
  if (minutes < 48 * 60) return `${Math.floor(minutes / 60)} h`;
  return `${Math.floor(minutes / (24 * 60))} d`;
}
