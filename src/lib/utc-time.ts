// Times as the console writes them: UTC, like the API, with the zone named in the column header.
const NO_TIME = '—';

/** "2024-03-04 06:00" from an ISO instant. */
export function utcMinute(iso: string | null): string {
  return iso ? iso.slice(0, 16).replace('T', ' ') : NO_TIME;
}

/** "2024-03-04 06:00:40" from an ISO instant. */
export function utcSecond(iso: string | null): string {
  return iso ? iso.slice(0, 19).replace('T', ' ') : NO_TIME;
}
