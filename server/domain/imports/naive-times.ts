// A burn time written without a UTC offset, in a file whose profile names no time zone, was read
// as UTC only because nothing said otherwise. Near the start of a correction set, that guess
// decides which set corrects the burn, so such lines are refused until the profile names the
// instrument's time zone. The window of one hour is common practice, no source (an instrument's
// true offset can be larger, which is why every import read this way also carries a warning).
import type { Issue, ParsedFile } from './parse/index.ts';

export const NAIVE_TIME_GUARD_MINUTES = 60;

/** Adds an issue to each such line (and its sample); `starts` are the sets' effective_from. */
export function refuseNaiveTimesNearCorrections(parsed: ParsedFile, starts: string[]): void {
  if (parsed.naive_time_lines.length === 0 || starts.length === 0) return;
  const naive = new Set(parsed.naive_time_lines);
  const column = parsed.columns.find((c) => c.role === 'measured_at')?.header;
  const guard = NAIVE_TIME_GUARD_MINUTES * 60_000;
  for (const sample of parsed.samples) {
    for (const burn of sample.burns) {
      if (!naive.has(burn.line) || !burn.measured_at) continue;
      const at = Date.parse(burn.measured_at);
      const start = starts.find((s) => Math.abs(Date.parse(s) - at) < guard);
      if (start === undefined) continue;
      const issue: Issue = {
        line: burn.line,
        column,
        code: 'time_zone_needed',
        message: `Line ${burn.line}: its time has no UTC offset and, read as UTC (${burn.measured_at}), lies within ${NAIVE_TIME_GUARD_MINUTES} minutes of the correction set in force from ${start}, so which set applies depends on the instrument's time zone. Name it in an import profile (time.time_zone) and upload again.`,
      };
      sample.rejected.push(issue);
      parsed.rejected.push(issue);
    }
  }
}
