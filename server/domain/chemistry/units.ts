// Mass-fraction units and their exact relation to the canonical unit, percent (SI brochure;
// NIST SP 811 §7.10): 1 % = 10 000 mg/kg ("ppm") = 10 000 000 µg/kg ("ppb"); a bare mass
// fraction 0.01 = 1 %. Conversions run on decimal strings with decimal.js, so no float noise
// reaches storage. Every factor is a power of ten, so a conversion only moves the decimal point:
// it is exact, and the result is written in plain notation ("0.0000001", never "1e-7").
import { Decimal } from 'decimal.js';

/** decimal.js rounds products to its precision (20 digits by default): a 34-digit mean must not be. */
const Exact = Decimal.clone({ precision: 200 });

export const UNITS = ['%', 'ppm', 'ppb', 'fraction'] as const;
export type Unit = (typeof UNITS)[number];
/** Units a result can be returned in (`?unit=`). */
export const OUTPUT_UNITS = ['%', 'ppm', 'ppb'] as const;
export type OutputUnit = (typeof OUTPUT_UNITS)[number];

/** One percent is 10^shift of the unit: 1 % = 10^4 ppm = 10^7 ppb = 10^-2 (mass fraction). */
export const PERCENT_SHIFT: Record<Unit, number> = { '%': 0, ppm: 4, ppb: 7, fraction: -2 };

const PER_PERCENT: Record<Unit, Decimal> = {
  '%': new Exact(1),
  ppm: new Exact(10).pow(PERCENT_SHIFT.ppm),
  ppb: new Exact(10).pow(PERCENT_SHIFT.ppb),
  fraction: new Exact(10).pow(PERCENT_SHIFT.fraction),
};

const ALIASES: Record<string, Unit> = {
  '%': '%',
  'wt%': '%',
  'wt.%': '%',
  'wt %': '%',
  'mass%': '%',
  'mass %': '%',
  percent: '%',
  ppm: 'ppm',
  'mg/kg': 'ppm',
  'µg/g': 'ppm',
  'μg/g': 'ppm',
  'ug/g': 'ppm',
  ppb: 'ppb',
  'µg/kg': 'ppb',
  'μg/kg': 'ppb', // Greek mu (U+03BC) as well as the micro sign (U+00B5)
  'ug/kg': 'ppb',
  fraction: 'fraction',
  'mass fraction': 'fraction',
  'kg/kg': 'fraction',
  'g/g': 'fraction',
};
/** Looked up through a Map: a header "Mn constructor" must not find Object's members in ALIASES. */
const ALIAS_LOOKUP = new Map(Object.entries(ALIASES));

/** Recognises a unit as written in a header, profile or request; undefined when unknown. */
export function parseUnit(text: string): Unit | undefined {
  return ALIAS_LOOKUP.get(text.trim().toLowerCase().replace(/\s+/g, ' '));
}

/** A decimal string in `unit` → the same quantity in percent, as an exact decimal string. */
export function toPercent(value: string, unit: Unit): string {
  return plain(new Exact(value).div(PER_PERCENT[unit]));
}

/** A percent decimal string → the same quantity in `unit`, as an exact decimal string. */
export function fromPercent(percent: string, unit: Unit): string {
  return plain(new Exact(percent).mul(PER_PERCENT[unit]));
}

/** Plain notation, no exponent, no "-0". */
function plain(value: Decimal): string {
  return value.isZero() ? '0' : value.toFixed();
}
