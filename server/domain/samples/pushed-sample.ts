// Normalises a JSON-pushed sample: element symbols to canonical case, every value parsed
// (qualified values allowed) and converted exactly to %. Every problem is collected, so one
// 400 names them all.
import type { FieldError } from '../../lib/problems.ts';
import { normaliseElement } from '../chemistry/elements.ts';
import { MeasuredValueError, parseMeasuredValue } from '../chemistry/measured-value.ts';
import { toPercent, type Unit } from '../chemistry/units.ts';
import type { NewBurn } from './sample-builder.ts';
import type { PushedBurnSchema } from './samples.schemas.ts';
import type { z } from '../../lib/zod.ts';

export type PushedBurn = z.output<typeof PushedBurnSchema>;

export function normalisePushedBurns(burns: PushedBurn[], unit: Unit, location: string, errors: FieldError[]): NewBurn[] {
  return burns.map((burn, index) => {
    const at = `${location}.${index}`;
    const values: NewBurn['values'] = {};
    const raw: NewBurn['raw'] = {};
    for (const [key, cell] of Object.entries(burn.values)) {
      const element = normaliseElement(key);
      if (!element) {
        errors.push({ location: `${at}.values.${key}`, message: `"${key}" is not an element symbol`, code: 'unknown_element' });
        continue;
      }
      if (values[element]) {
        errors.push({ location: `${at}.values.${key}`, message: `${element} is given twice in this burn`, code: 'duplicate_element' });
        continue;
      }
      try {
        const parsed = parseMeasuredValue(cell);
        if (parsed.kind === 'blank') continue;
        const value = parsed.value === null ? null : toPercent(parsed.value, unit);
        values[element] = { v: value, q: parsed.qualifier };
        if (String(cell) !== value || unit !== '%') raw[element] = { raw: String(cell), unit };
      } catch (error) {
        if (!(error instanceof MeasuredValueError)) throw error;
        errors.push({ location: `${at}.values.${key}`, message: error.message, code: 'bad_value' });
      }
    }
    if (Object.keys(values).length === 0 && !errors.some((e) => e.location.startsWith(`${at}.`))) {
      errors.push({ location: `${at}.values`, message: 'a burn needs at least one measured value', code: 'empty_burn' });
    }
    return { burn_number: index + 1, measured_at: burn.measured_at ? new Date(burn.measured_at).toISOString() : null, values, raw };
  });
}
