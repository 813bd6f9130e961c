// Limits typed as text, one element per line, so that their written decimals survive:
//   "C 0.43-0.50" (a range), "P 0.040" (a maximum), "Cr 18.0–20.0", "Si >=0.40" (a minimum).
export interface LimitLine {
  element: string;
  min?: string;
  max?: string;
}

const DECIMAL = '(\\d+(?:\\.\\d+)?)';
const RANGE = new RegExp(`^([A-Za-z]{1,2})\\s+${DECIMAL}\\s*[-–]\\s*${DECIMAL}$`);
const MAX = new RegExp(`^([A-Za-z]{1,2})\\s+(?:<=|≤)?\\s*${DECIMAL}$`);
const MIN = new RegExp(`^([A-Za-z]{1,2})\\s+(?:>=|≥)\\s*${DECIMAL}$`);

/** The limits of the text, or the first line that cannot be read (1-based). */
export function parseLimits(text: string): { limits: LimitLine[] } | { error: string } {
  const limits: LimitLine[] = [];
  const lines = text.split('\n');
  for (const [i, raw] of lines.entries()) {
    const line = raw.trim();
    if (!line) continue;
    const range = RANGE.exec(line);
    const max = MAX.exec(line);
    const min = MIN.exec(line);
    if (range) limits.push({ element: range[1], min: range[2], max: range[3] });
    else if (min) limits.push({ element: min[1], min: min[2] });
    else if (max) limits.push({ element: max[1], max: max[2] });
    else return { error: `Line ${i + 1} ("${line}") is not "El min–max", "El max" or "El >=min".` };
  }
  return limits.length ? { limits } : { error: 'Give at least one limit.' };
}

export function limitsText(limits: readonly LimitLine[]): string {
  return limits
    .map((l) => (l.min && l.max ? `${l.element} ${l.min}–${l.max}` : l.min ? `${l.element} >=${l.min}` : `${l.element} ${l.max}`))
    .join('\n');
}
