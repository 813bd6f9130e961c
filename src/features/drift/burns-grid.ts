// Plain logic of the burns grid of a standardization run: one row per burn, one cell per element
// of the method, each cell the text as typed or read from the file ("0.452", "<0.002", "n.d.").
// The server reads every value (the rule every way in shares); here only the shape is checked.

/** Element → cell text of one burn. */
export type BurnRow = Record<string, string>;

export const EMPTY_BURNS = 3;

export function emptyRows(count = EMPTY_BURNS): BurnRow[] {
  return Array.from({ length: count }, () => ({}));
}

/** A decimal comma as spreadsheets in many labs write it ("0,452", "<0,002") is read as a point. */
function normaliseCell(text: string): string {
  const trimmed = text.trim();
  return /^[<>]?\s*\d+,\d+$/.test(trimmed) ? trimmed.replace(',', '.') : trimmed;
}

/** The burns to send: rows with no value left out, cells trimmed; an error when none is left. */
export function burnsFromRows(rows: readonly BurnRow[]): { burns?: Record<string, string>[]; error?: string } {
  const burns = rows
    .map((row) => Object.fromEntries(Object.entries(row).flatMap(([el, text]) => (normaliseCell(text) ? [[el, normaliseCell(text)]] : []))))
    .filter((burn) => Object.keys(burn).length > 0);
  if (burns.length === 0) return { error: 'Type at least one burn, or read the burns from the instrument’s file.' };
  return { burns };
}

/** Which grid row each sent burn came from (rows with no value are not sent), to place the server's errors. */
export function sentRowIndexes(rows: readonly BurnRow[]): number[] {
  return rows.flatMap((row, i) => (Object.values(row).some((text) => text.trim()) ? [i] : []));
}

/**
 * Text pasted from a spreadsheet (tab-separated columns, one line per burn) into the grid from
 * cell (row, element): the grid grows by as many rows as needed.
 */
export function pasteIntoRows(
  rows: readonly BurnRow[],
  row: number,
  element: string,
  text: string,
  elements: readonly string[],
): BurnRow[] {
  const lines = text.replace(/\r\n?/g, '\n').replace(/\n$/, '').split('\n');
  const start = elements.indexOf(element);
  const next = rows.map((r) => ({ ...r }));
  lines.forEach((line, i) => {
    const target = row + i;
    while (next.length <= target) next.push({});
    line.split('\t').forEach((cell, j) => {
      const el = elements[start + j];
      if (el) next[target][el] = cell.trim();
    });
  });
  return next;
}

/** True when the text holds more than one cell (a paste the grid spreads out). */
export function isGridPaste(text: string): boolean {
  return /[\t\n]/.test(text.replace(/\r?\n$/, ''));
}
