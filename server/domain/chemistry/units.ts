// Mass-fraction units and their exact relation to the canonical unit, percent (SI brochure;
// NIST SP 811 §7.10): 1 % = 10 000 mg/kg ("ppm") = 10 000 000 µg/kg ("ppb"); a bare mass
// fraction 0.01 = 1 %. Conversions run on decimal strings with decimal.js, so no float noise
// reaches storage.
import { Decimal } from 'decimal.js';

export const UNITS = ['%', 'ppm', 'ppb', 'fraction'] as const;
export type Unit = (typeof UNITS)[number];
/** Units a result can be returned in (`?unit=`). */
export const OUTPUT_UNITS = ['%', 'ppm', 'ppb'] as const;
export type OutputUnit = (typeof OUTPUT_UNITS)[number];

/** How many of the unit make one percent. */
const PER_PERCENT: Record<Unit, Decimal> = {
  '%': new Decimal(1),
  ppm: new Decimal(10_000),
  ppb: new Decimal(10_000_000),
  fraction: new Decimal('0.01'),
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

/** Recognises a unit as written in a header, profile or request; undefined when unknown. */
export function parseUnit(text: string): Unit | undefined {
  return ALIASES[text.trim().toLowerCase().replace(/\s+/g, ' ')];
}

// toFixed() without arguments prints every digit in plain notation: toString() would write
// 5 µg/kg as "5e-7" %, which is not the decimal string callers store and compare.

/** A decimal string in `unit` → the same quantity in percent, as an exact decimal string. */
export function toPercent(value: string, unit: Unit): string {
  return new Decimal(value).div(PER_PERCENT[unit]).toFixed();
}

/** A percent decimal string → the same quantity in `unit`, as an exact decimal string. */
export function fromPercent(percent: string, unit: Unit): string {
  return new Decimal(percent).mul(PER_PERCENT[unit]).toFixed();
}
