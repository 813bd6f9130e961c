// Reads an element column header: a symbol in any case with an optional unit, written
// "Mn", "Mn %", "Mn%", "%Mn", "Mn [%]", "C [ppm]", "Si(%)", "Cu mg/kg".
import { type ElementSymbol, normaliseElement } from '../../chemistry/elements.ts';
import { parseUnit, type Unit } from '../../chemistry/units.ts';

export type ElementHeader =
  | { kind: 'element'; element: ElementSymbol; unit?: Unit }
  /** Looks like an element column (it carries a unit) but the symbol is not an element. */
  | { kind: 'unknown_element'; symbol: string }
  /** A real symbol with a bracketed unit that is not a mass-fraction unit. */
  | { kind: 'unknown_unit'; element: ElementSymbol; unit: string }
  /** A bare one- or two-letter header that is no element symbol ("Xx", "ID"). */
  | { kind: 'short_unknown' }
  | { kind: 'not_element' };

const BRACKETED = /^([A-Za-z]{1,2})\s*(?:\[([^\]]*)\]|\(([^)]*)\))$/;
const SUFFIX = /^([A-Za-z]{1,2})(?:\s+|(?=%))(\S.*)$/;
const PREFIX = /^%\s*([A-Za-z]{1,2})$/;
const BARE = /^[A-Za-z]{1,2}$/;

function withUnit(symbol: string, unitText: string, bracketed: boolean): ElementHeader {
  const element = normaliseElement(symbol);
  if (unitText.trim() === '' && element) return { kind: 'element', element }; // "Mn []"
  const unit = parseUnit(unitText);
  if (unit) return element ? { kind: 'element', element, unit } : { kind: 'unknown_element', symbol };
  // "Fe base" or "No of" is prose, not a unit; "Fe (calc)" is an element with a unit we cannot read.
  return bracketed && element ? { kind: 'unknown_unit', element, unit: unitText.trim() } : { kind: 'not_element' };
}

export function parseElementHeader(header: string): ElementHeader {
  const text = header.trim();
  if (BARE.test(text)) {
    const element = normaliseElement(text);
    return element ? { kind: 'element', element } : { kind: 'short_unknown' };
  }
  const prefixed = PREFIX.exec(text);
  if (prefixed) return withUnit(prefixed[1], '%', false);
  const bracketed = BRACKETED.exec(text);
  if (bracketed) return withUnit(bracketed[1], bracketed[2] ?? bracketed[3], true);
  const suffixed = SUFFIX.exec(text);
  if (suffixed) return withUnit(suffixed[1], suffixed[2], false);
  return { kind: 'not_element' };
}
