// Dates and times typed by hand in ISO 8601 order (yyyy-mm-dd, yyyy-mm-dd HH:mm) whatever the
// browser's locale, so a lab never has to guess whether 03/04 is March or April. Times typed are
// read in the reader's own zone, as the field's label says.

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const DATE_TIME = /^(\d{4})-(\d{2})-(\d{2})[ T](\d{2}):(\d{2})$/;

export const ISO_DATE_PATTERN = '\\d{4}-\\d{2}-\\d{2}';
export const ISO_DATE_TIME_PATTERN = '\\d{4}-\\d{2}-\\d{2}[ T]\\d{2}:\\d{2}';

function isCalendarDay(year: number, month: number, day: number): boolean {
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

/** "2026-12-03" when the text is a real calendar day written yyyy-mm-dd (spaces around ignored); null otherwise. */
export function readIsoDate(text: string): string | null {
  const match = DATE.exec(text.trim());
  if (!match) return null;
  const [, year, month, day] = match.map(Number) as [number, number, number, number];
  return isCalendarDay(year, month, day) ? `${match[1]}-${match[2]}-${match[3]}` : null;
}

/**
 * The instant meant by "2026-12-03 06:00" (or "2026-12-03T06:00") in the reader's zone; null when
 * the text is not such a time. A time the clocks skip at a DST change (02:30 on the spring-forward
 * night in Europe) moves forward by the gap, as Date does.
 */
export function readIsoDateTime(text: string): Date | null {
  const match = DATE_TIME.exec(text.trim());
  if (!match) return null;
  const [, year, month, day, hour, minute] = match.map(Number) as [number, number, number, number, number, number];
  if (!isCalendarDay(year, month, day) || hour > 23 || minute > 59) return null;
  return new Date(year, month - 1, day, hour, minute);
}

/** "2026-12-03 06:00": a value for a date-time field, in the reader's zone. */
export function toIsoDateTimeText(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())} ${pad(date.getHours())}:${pad(date.getMinutes())}`;
}
