// The one rule for a measured value, whichever way it comes in (JSON push, batch, standardization
// burns, file import): a number or a qualified value ("<0.001", ">1.5") or "n.d."; finite; not
// negative; at most 100 % once converted to % (a mass fraction cannot be more). Every way in
// reports the same cause in the same words.
import { Decimal } from 'decimal.js';
import { MeasuredValueError, parseMeasuredValue, type Qualifier } from './measured-value.ts';
import { toPercent, type Unit } from './units.ts';

const HUNDRED = new Decimal(100);

export interface MassFraction {
  /** In %, an exact decimal string; null for "n.d.". */
  value: string | null;
  qualifier: Qualifier | null;
}

/** Reads a value in `unit` into %; null for a blank (not measured). Throws MeasuredValueError naming the cause. */
export function readMassFraction(raw: string | number, unit: Unit, decimalSeparator: '.' | ',' = '.'): MassFraction | null {
  const parsed = parseMeasuredValue(raw, decimalSeparator);
  if (parsed.kind === 'blank') return null;
  if (parsed.kind === 'not_detected') return { value: null, qualifier: 'nd' };
  const percent = toPercent(parsed.value, unit);
  if (new Decimal(percent).gt(HUNDRED)) throw new MeasuredValueError(`${parsed.qualifier ?? ''}${parsed.value} ${unit} is above 100 %`);
  return { value: percent, qualifier: parsed.qualifier };
}
