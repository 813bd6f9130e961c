// File sizes for people: binary multiples (IEC 80000-13: 1 KiB = 1024 bytes), one decimal at most.
const UNITS = ['KiB', 'MiB', 'GiB'] as const;
const grouped = new Intl.NumberFormat('en');

/** "512 bytes", "1.5 KiB", "20 MiB". */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${grouped.format(bytes)} ${bytes === 1 ? 'byte' : 'bytes'}`;
  let value = bytes;
  let unit = 0;
  for (value /= 1024; value >= 1024 && unit < UNITS.length - 1; value /= 1024) unit += 1;
  return `${grouped.format(Math.round(value * 10) / 10)} ${UNITS[unit]}`;
}

/** "20 MiB (20,971,520 bytes)": the rounded size with the exact count, for limits. */
export function formatBytesExactly(bytes: number): string {
  return bytes < 1024 ? formatBytes(bytes) : `${formatBytes(bytes)} (${grouped.format(bytes)} bytes)`;
}
