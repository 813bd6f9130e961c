// A composition as a client sends it ({ "Mn": 0.71, "S": "<0.002" }) → one measured value per
// canonical element symbol. A JSON number is read as its shortest decimal form (0.145 is 0.145);
// every problem is collected so one 400 names them all.
import { type ElementSymbol, normaliseElement } from '../chemistry/elements.ts';
import { type MeasuredValue, MeasuredValueError, parseMeasuredValue } from '../chemistry/measured-value.ts';
import { type FieldError, ValidationProblem } from '../../lib/problems.ts';

export function parseComposition(input: Record<string, number | string>, location = 'body.composition'): Map<ElementSymbol, MeasuredValue> {
  const composition = new Map<ElementSymbol, MeasuredValue>();
  const errors: FieldError[] = [];
  for (const [key, raw] of Object.entries(input)) {
    const symbol = normaliseElement(key);
    if (!symbol) {
      errors.push({ location: `${location}.${key}`, message: `"${key}" is not an element symbol` });
      continue;
    }
    if (composition.has(symbol)) {
      errors.push({ location: `${location}.${key}`, message: `${symbol} is given twice` });
      continue;
    }
    try {
      const value = parseMeasuredValue(raw);
      if (value.kind !== 'blank') composition.set(symbol, value);
    } catch (error) {
      if (!(error instanceof MeasuredValueError)) throw error;
      errors.push({ location: `${location}.${key}`, message: error.message });
    }
  }
  if (errors.length > 0) throw new ValidationProblem(errors);
  return composition;
}

/** The element with the largest value: the matrix of a composition when none is named. */
export function largestElement(composition: ReadonlyMap<string, MeasuredValue>): string | undefined {
  let best: { symbol: string; value: number } | undefined;
  for (const [symbol, m] of composition) {
    if (m.kind !== 'value') continue;
    const value = Number(m.value);
    if (!best || value > best.value) best = { symbol, value };
  }
  return best?.symbol;
}
