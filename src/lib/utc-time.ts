// @deprecated: the console's one clock is <Timestamp> (src/components/ui/timestamp.tsx) or
// formatInstant (src/lib/timestamp.ts) in plain text. These names remain for code still calling them.
import { formatInstant } from './timestamp.ts';

/** @deprecated Use <Timestamp> or formatInstant. */
export function utcMinute(iso: string | null): string {
  return formatInstant(iso);
}

/** @deprecated Use <Timestamp seconds> or formatInstant(iso, { seconds: true }). */
export function utcSecond(iso: string | null): string {
  return formatInstant(iso, { seconds: true });
}
