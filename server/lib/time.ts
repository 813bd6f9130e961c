/** Current time as an ISO 8601 UTC string with milliseconds (the storage format for timestamps). */
export function nowIso(): string {
  return new Date().toISOString();
}

export function addMinutes(iso: string, minutes: number): string {
  return new Date(Date.parse(iso) + minutes * 60_000).toISOString();
}

/** How far ahead of the server's clock a measurement time may be (instrument clocks drift): 5 minutes. Common practice, no source. */
export const CLOCK_SKEW_ALLOWANCE_MINUTES = 5;

/** The latest measurement time accepted now: later ones are in the future. */
export function latestMeasurementTime(): string {
  return addMinutes(nowIso(), CLOCK_SKEW_ALLOWANCE_MINUTES);
}
