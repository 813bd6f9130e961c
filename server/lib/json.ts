/** Parses a JSON text column; null stays null. */
export function parseJsonColumn<T>(value: string | null | undefined): T | null {
  return value == null ? null : (JSON.parse(value) as T);
}

export function toJsonColumn(value: unknown): string | null {
  return value === undefined || value === null ? null : JSON.stringify(value);
}
