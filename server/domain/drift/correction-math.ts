/*
 * The arithmetic of a drift correction (standardization), on decimal strings with decimal.js.
 *
 * Modes (math as practised; no readable standard gives the formula — see docs/references.md#drift-correction):
 * - two_point:        slope α = (H⁰ − L⁰)/(H − L), offset β = L⁰ − α·L   (H, L measured; H⁰, L⁰ nominal)
 * - one_point_factor: α = N/M, β = 0
 * - one_point_offset: α = 1,   β = N − M
 * - type:             a reference of similar composition, multiplicative: the measured value is
 *                     first corrected with the set in force (α₀, β₀), then the factor
 *                     t = N/(α₀·M + β₀) is applied; the stored set is the composition
 *                     α = t·α₀, β = t·β₀, so it replaces the set in force and includes it.
 * corrected = α·x + β for every value x.
 *
 * Precision: α is computed at 60 significant digits and stored rounded half-even to 20
 * significant digits, β to 20 decimal places (in %). Both are far below any measurement
 * uncertainty. α·x + β itself is computed EXACTLY (a product and a sum of finite decimals), so
 * Σ(α·xᵢ + β) = α·Σxᵢ + n·β holds digit for digit: correcting burns and then averaging gives the
 * same mean as averaging and then correcting. The short α and β also keep corrected values short
 * (≤ ~30 digits for values up to 100 % with up to 6 decimals and slopes from 0.1 to 10), so the
 * 34-digit exact mean (exact-mean.ts) sums up to 50 of them without rounding.
 */
import { Decimal } from 'decimal.js';
import { formatScaled } from '../chemistry/exact-mean.ts';
import type { StoredCell } from '../samples/samples.repository.ts';

const SLOPE_SIGNIFICANT_DIGITS = 20;
const OFFSET_DECIMALS = 20;

/** Wide enough for the quotients before they are rounded to the stored digits. */
const Work = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_EVEN });
/** Products and sums of stored slopes, offsets and values never need more than ~70 digits: exact. */
const Exact = Decimal.clone({ precision: 200 });

export const CORRECTION_MODES = ['two_point', 'one_point_factor', 'one_point_offset', 'type'] as const;
export type CorrectionMode = (typeof CORRECTION_MODES)[number];

export interface Correction {
  /** α, decimal string. */
  slope: string;
  /** β in %, decimal string. */
  offset: string;
}

/** A reference's nominal (certified) value and the mean measured today, both in %. */
export interface Level {
  nominal: string;
  measured: string;
}

/** The numbers cannot give a correction (H = L, a zero to divide by): the run answers 422. */
export class CorrectionMathError extends Error {}

function plain(value: Decimal): string {
  return value.isZero() ? '0' : value.toFixed();
}

function roundSlope(value: Decimal): string {
  return plain(new Work(value).toSignificantDigits(SLOPE_SIGNIFICANT_DIGITS, Decimal.ROUND_HALF_EVEN));
}

function roundOffset(value: Decimal): string {
  return plain(new Exact(value).toDecimalPlaces(OFFSET_DECIMALS, Decimal.ROUND_HALF_EVEN));
}

export function twoPoint(high: Level, low: Level): Correction {
  const span = new Exact(high.measured).minus(low.measured);
  if (span.isZero())
    throw new CorrectionMathError(
      `the high and low references measured the same value (H = L = ${low.measured} %), so no slope can be computed`,
    );
  const nominalSpan = new Exact(high.nominal).minus(low.nominal);
  if (nominalSpan.isZero())
    throw new CorrectionMathError(
      `the high and low references have the same nominal value (${low.nominal} %): a two-point correction needs two different levels`,
    );
  const slope = roundSlope(new Work(nominalSpan).div(new Work(span)));
  const offset = roundOffset(new Exact(low.nominal).minus(new Exact(slope).times(low.measured)));
  return { slope, offset };
}

export function onePointFactor(reference: Level): Correction {
  if (new Exact(reference.measured).isZero()) throw new CorrectionMathError('the reference measured 0, so no factor can be computed');
  if (new Exact(reference.nominal).isZero())
    throw new CorrectionMathError('the nominal value is 0, which would multiply every result by 0');
  return { slope: roundSlope(new Work(reference.nominal).div(reference.measured)), offset: '0' };
}

export function onePointOffset(reference: Level): Correction {
  return { slope: '1', offset: roundOffset(new Exact(reference.nominal).minus(reference.measured)) };
}

/** Type standardization (multiplicative) on top of `base`, the set in force (identity when none). */
export function typeCorrection(reference: Level, base: Correction | null): Correction {
  const baseSlope = base?.slope ?? '1';
  const baseOffset = base?.offset ?? '0';
  const measured = new Exact(baseSlope).times(reference.measured).plus(baseOffset);
  if (measured.isZero())
    throw new CorrectionMathError('the reference, corrected with the set in force, measures 0, so no factor can be computed');
  if (new Exact(reference.nominal).isZero())
    throw new CorrectionMathError('the nominal value is 0, which would multiply every result by 0');
  const factor = new Work(reference.nominal).div(new Work(measured));
  return { slope: roundSlope(factor.times(baseSlope)), offset: roundOffset(factor.times(baseOffset)) };
}

/** A plain decimal as an exact integer and its scale: "-0.0125" → { digits: -125n, scale: 4 }. */
interface Scaled {
  digits: bigint;
  scale: number;
}

const PLAIN = /^([+-]?)(\d+)(?:\.(\d+))?$/;

function toScaled(value: string): Scaled | undefined {
  const match = PLAIN.exec(value);
  if (!match) return undefined;
  const [, sign, integer, fraction = ''] = match;
  const digits = BigInt(integer + fraction);
  return { digits: sign === '-' ? -digits : digits, scale: fraction.length };
}

/** Parsed once per correction: the same set corrects every burn of an import. */
const scaledCorrections = new WeakMap<Correction, { slope: Scaled; offset: Scaled } | null>();

function scaledCorrection(correction: Correction) {
  let scaled = scaledCorrections.get(correction);
  if (scaled === undefined) {
    const slope = toScaled(correction.slope);
    const offset = toScaled(correction.offset);
    scaled = slope && offset ? { slope, offset } : null;
    scaledCorrections.set(correction, scaled);
  }
  return scaled;
}

const POWERS = Array.from({ length: 100 }, (_, i) => 10n ** BigInt(i));
const power = (k: number) => POWERS[k] ?? 10n ** BigInt(k);

/**
 * α·x + β, exactly, in plain notation. On the ingest path: plain decimals are multiplied as
 * BigInt integers at a common scale (≈ 4× faster than decimal.js); anything else goes through
 * decimal.js. A property test checks that both give identical strings.
 */
export function correctValue(value: string, correction: Correction): string {
  const c = scaledCorrection(correction);
  const x = c && toScaled(value);
  if (!c || !x) return correctValueWithDecimal(value, correction);
  const productScale = c.slope.scale + x.scale;
  const scale = Math.max(productScale, c.offset.scale);
  const sum = c.slope.digits * x.digits * power(scale - productScale) + c.offset.digits * power(scale - c.offset.scale);
  if (sum === 0n) return '0';
  const negative = sum < 0n;
  return formatScaled((negative ? -sum : sum).toString(), scale, negative);
}

/** The reference path: decimal.js at 200 digits (exact for these operands). */
export function correctValueWithDecimal(value: string, correction: Correction): string {
  return plain(new Exact(correction.slope).times(value).plus(correction.offset));
}

/**
 * Corrects one stored cell. A "<" or ">" bound is corrected like a value (α·bound + β): the
 * correction is monotonic, so the bound stays a bound — with the sign flipped when α < 0.
 * n.d. (no value) and unmeasured cells stay as they are.
 */
export function correctCell(cell: StoredCell, correction: Correction): StoredCell {
  if (cell.v === null) return cell;
  const value = correctValue(cell.v, correction);
  if (cell.q === '<' || cell.q === '>') {
    const flipped = new Exact(correction.slope).isNegative();
    return { v: value, q: flipped ? (cell.q === '<' ? '>' : '<') : cell.q };
  }
  return { v: value, q: cell.q };
}

/** Corrects every element the set covers; the others are copied unchanged. */
export function correctCells(values: Record<string, StoredCell>, corrections: ReadonlyMap<string, Correction>): Record<string, StoredCell> {
  const out: Record<string, StoredCell> = {};
  for (const [element, cell] of Object.entries(values)) {
    const correction = corrections.get(element);
    out[element] = correction ? correctCell(cell, correction) : cell;
  }
  return out;
}
