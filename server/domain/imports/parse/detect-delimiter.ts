// Chooses `,` `;` or tab from the header line and the lines after it: the candidate that splits
// the header into the most columns wins, provided the data lines split into as many (or, with
// fewer consistent lines, the best agreement wins). Quotes are respected, so a quoted "0,75"
// does not count. A `;` file with decimal commas is therefore read as `;`: its header holds no
// commas, and its data lines disagree with it about the comma count.
import { type Delimiter, layoutError } from './types.ts';

const CANDIDATES: Delimiter[] = [';', ',', '\t'];
const SAMPLE_LINES = 50;

export function physicalLines(text: string): string[] {
  return text.split(/\r\n|\r|\n/);
}

function fieldCount(line: string, delimiter: Delimiter): number {
  let count = 1;
  let quoted = false;
  for (let i = 0; i < line.length; i += 1) {
    const ch = line[i];
    if (ch === '"') quoted = !quoted;
    else if (ch === delimiter && !quoted) count += 1;
  }
  return count;
}

/** `headerRow` is 1-based. */
export function detectDelimiter(lines: string[], headerRow: number): Delimiter {
  const header = lines[headerRow - 1] ?? '';
  const data = lines.slice(headerRow, headerRow + SAMPLE_LINES).filter((line) => line.trim() !== '');
  let best: { delimiter: Delimiter; agreement: number; columns: number } | undefined;
  for (const delimiter of CANDIDATES) {
    const columns = fieldCount(header, delimiter);
    if (columns < 2) continue;
    const agreeing = data.filter((line) => fieldCount(line, delimiter) === columns).length;
    const agreement = data.length === 0 ? 1 : agreeing / data.length;
    if (!best || agreement > best.agreement || (agreement === best.agreement && columns > best.columns)) {
      best = { delimiter, agreement, columns };
    }
  }
  if (!best) {
    throw layoutError(
      'no_delimiter',
      `The header on line ${headerRow} is a single column: expected columns separated by ",", ";" or tab.`,
      { line: headerRow },
    );
  }
  return best.delimiter;
}

/** The first line that is not blank (1-based), or undefined for a blank file. */
export function firstNonBlankLine(lines: string[]): number | undefined {
  const index = lines.findIndex((line) => line.trim() !== '');
  return index < 0 ? undefined : index + 1;
}
