// Burn times as instruments write them → ISO 8601 UTC. Times without an offset are read in the
// profile's time zone (IANA name, daylight saving included) or at its fixed UTC offset (or as UTC).
// Calendar fields are range-checked, so "2024-02-30 10:00" is refused instead of rolling over
// into March.
import { wallClockToUtc } from './zoned-time.ts';

export const TIME_FORMATS = ['auto', 'iso8601', 'YYYY-MM-DD HH:mm[:ss]', 'DD.MM.YYYY HH:mm[:ss]'] as const;
export type TimeFormat = (typeof TIME_FORMATS)[number];

export const UTC_OFFSET_PATTERN = /^(Z|[+-](0\d|1[0-3]):[0-5]\d|[+-]14:00)$/;

const OFFSET = '(Z|[+-]\\d{2}(?::?\\d{2})?)';
const CLOCK = '(\\d{2}):(\\d{2})(?::(\\d{2})(?:[.,](\\d{1,9}))?)?';
const PATTERNS: Record<Exclude<TimeFormat, 'auto'>, { regex: RegExp; order: 'ymd' | 'dmy' }> = {
  iso8601: { regex: new RegExp(`^(\\d{4})-(\\d{2})-(\\d{2})T${CLOCK}${OFFSET}?$`), order: 'ymd' },
  'YYYY-MM-DD HH:mm[:ss]': { regex: new RegExp(`^(\\d{4})-(\\d{2})-(\\d{2}) +${CLOCK}$`), order: 'ymd' },
  'DD.MM.YYYY HH:mm[:ss]': { regex: new RegExp(`^(\\d{1,2})\\.(\\d{1,2})\\.(\\d{4}) +${CLOCK}$`), order: 'dmy' },
};

/** Minutes east of UTC for "Z", "+01:00", "+0100", "-05". */
function offsetMinutes(offset: string): number | undefined {
  if (offset === 'Z') return 0;
  const sign = offset[0] === '-' ? -1 : 1;
  const digits = offset.slice(1).replace(':', '');
  const [hours, minutes] = [Number(digits.slice(0, 2)), Number(digits.slice(2, 4) || 0)];
  if (minutes > 59 || hours * 60 + minutes > 14 * 60) return undefined;
  return sign * (hours * 60 + minutes);
}

const DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

function daysInMonth(year: number, month: number): number {
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return month === 2 && leap ? 29 : DAYS[month - 1];
}

export interface ParsedTime {
  iso: string;
  /** True when the text carried its own offset. */
  hadOffset: boolean;
  /** The wall-clock time occurs twice in the zone (the hour the clocks go back); the first was taken. */
  ambiguous?: boolean;
}

/** A wall-clock time the zone skips (the hour the clocks go forward): it never happened there. */
export interface SkippedTime {
  skipped: true;
}

const ALL_FORMATS = Object.keys(PATTERNS) as (keyof typeof PATTERNS)[];

/**
 * The time in UTC, or undefined when the text is not a valid time in the format. `zone` reads
 * times written without an offset: "Z", a fixed offset ("+01:00") or an IANA name ("Europe/Berlin").
 */
export function parseBurnTime(text: string, format: TimeFormat, zone: string): ParsedTime | SkippedTime | undefined {
  const trimmed = text.trim();
  for (const name of format === 'auto' ? ALL_FORMATS : [format]) {
    const { regex, order } = PATTERNS[name];
    const m = regex.exec(trimmed);
    if (!m) continue;
    const year = Number(order === 'ymd' ? m[1] : m[3]);
    const month = Number(m[2]);
    const day = Number(order === 'ymd' ? m[3] : m[1]);
    const hour = Number(m[4]);
    const minute = Number(m[5]);
    const second = m[6] === undefined ? 0 : Number(m[6]);
    // Date.UTC maps years 0–99 to 1900–1999; refuse early years rather than guess.
    if (year < 1900 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month) || hour > 23 || minute > 59 || second > 59)
      return undefined;
    const millis = m[7] === undefined ? 0 : Number(m[7].padEnd(3, '0').slice(0, 3));
    const wall = Date.UTC(year, month - 1, day, hour, minute, second, millis);
    if (m[8] === undefined && !UTC_OFFSET_PATTERN.test(zone)) {
      const zoned = wallClockToUtc(wall, zone);
      if ('skipped' in zoned) return zoned;
      return { iso: new Date(zoned.utcMillis).toISOString(), hadOffset: false, ambiguous: zoned.ambiguous };
    }
    const shift = offsetMinutes(m[8] ?? zone);
    if (shift === undefined) return undefined;
    return { iso: new Date(wall - shift * 60_000).toISOString(), hadOffset: m[8] !== undefined };
  }
  return undefined;
}
