// Chooses the decimal separator from the element cells. A comma-delimited file uses "." (an
// unquoted decimal comma would split the cell). Otherwise "," wins when more cells write a
// digit-comma-digit ("0,75", "<0,001") than a digit-dot-digit; integers alone give ".".
import type { DecimalSeparator, Delimiter } from './types.ts';

const COMMA_DECIMAL = /(^|\d|[<>]),\d/;
const DOT_DECIMAL = /(^|\d|[<>])\.\d/;
const SAMPLE_ROWS = 500;

export function detectDecimalSeparator(rows: string[][], valueColumns: number[], delimiter: Delimiter): DecimalSeparator {
  if (delimiter === ',') return '.';
  let commas = 0;
  let dots = 0;
  for (const cells of rows.slice(0, SAMPLE_ROWS)) {
    for (const index of valueColumns) {
      const cell = cells[index];
      if (!cell) continue;
      if (COMMA_DECIMAL.test(cell)) commas += 1;
      else if (DOT_DECIMAL.test(cell)) dots += 1;
    }
  }
  return commas > dots ? ',' : '.';
}
