/** Current time as an ISO 8601 UTC string with milliseconds (the storage format for timestamps). */
export function nowIso(): string {
  return new Date().toISOString();
}

export function addMinutes(iso: string, minutes: number): string {
  return new Date(Date.parse(iso) + minutes * 60_000).toISOString();
}
