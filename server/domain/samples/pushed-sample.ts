// Normalises a JSON-pushed sample: element symbols to canonical case, every value read by the
// rule every way in shares (readMassFraction: qualified values allowed, finite, not negative, at
// most 100 %) and converted exactly to %. Every problem is collected, so one 400 names them all,
// each as "Sample K24-0412-F1, burn 2, Ni: <cause>".
import type { FieldError } from '../../lib/problems.ts';
import { CLOCK_SKEW_ALLOWANCE_MINUTES, latestMeasurementTime } from '../../lib/time.ts';
import { normaliseElement } from '../chemistry/elements.ts';
import { readMassFraction } from '../chemistry/mass-fraction.ts';
import { MeasuredValueError } from '../chemistry/measured-value.ts';
import type { Unit } from '../chemistry/units.ts';
import type { NewBurn } from './sample-builder.ts';
import type { PushedBurnSchema } from './samples.schemas.ts';
import type { z } from '../../lib/zod.ts';

export type PushedBurn = z.output<typeof PushedBurnSchema>;

/** `subject` names what the burns belong to in messages: "Sample K24-0412-F1", "Measurement 2". */
export function normalisePushedBurns(burns: PushedBurn[], unit: Unit, location: string, subject: string, errors: FieldError[]): NewBurn[] {
  const latest = latestMeasurementTime();
  return burns.map((burn, index) => {
    const at = `${location}.${index}`;
    const burnLabel = `${subject}, burn ${index + 1}`;
    const measuredAt = burn.measured_at ? new Date(burn.measured_at).toISOString() : null;
    if (measuredAt && measuredAt > latest) {
      const message = `${burnLabel}: measured_at ${measuredAt} is in the future (more than ${CLOCK_SKEW_ALLOWANCE_MINUTES} minutes after the server's clock)`;
      errors.push({ location: `${at}.measured_at`, message, code: 'future_time' });
    }
    const values: NewBurn['values'] = {};
    const raw: NewBurn['raw'] = {};
    for (const [key, cell] of Object.entries(burn.values)) {
      const element = normaliseElement(key);
      if (!element) {
        errors.push({
          location: `${at}.values.${key}`,
          message: `${burnLabel}: "${key}" is not an element symbol`,
          code: 'unknown_element',
        });
        continue;
      }
      if (values[element]) {
        errors.push({ location: `${at}.values.${key}`, message: `${burnLabel}: ${element} is given twice`, code: 'duplicate_element' });
        continue;
      }
      try {
        const read = readMassFraction(cell, unit);
        if (!read) continue;
        values[element] = { v: read.value, q: read.qualifier };
        if (String(cell) !== read.value || unit !== '%') raw[element] = { raw: String(cell), unit };
      } catch (error) {
        if (!(error instanceof MeasuredValueError)) throw error;
        errors.push({ location: `${at}.values.${key}`, message: `${burnLabel}, ${element}: ${error.message}`, code: 'bad_value' });
      }
    }
    if (Object.keys(values).length === 0 && !errors.some((e) => e.location.startsWith(`${at}.`))) {
      errors.push({ location: `${at}.values`, message: `${burnLabel}: a burn needs at least one measured value`, code: 'empty_burn' });
    }
    return { burn_number: index + 1, measured_at: measuredAt, values, raw };
  });
}
