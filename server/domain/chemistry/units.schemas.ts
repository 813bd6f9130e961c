// The unit of values a client sends, written as a file header may write it: every way in accepts
// the same spellings (push, batch, standardization burns, reference-material nominals, file headers).
import { z } from '../../lib/zod.ts';
import { parseUnit, type Unit } from './units.ts';

export const UNIT_SPELLINGS = ['%', 'ppm', 'mg/kg', 'ppb', 'µg/kg', 'ug/kg', 'fraction'] as const;

const SPELLINGS_NOTE =
  '`%` (mass fraction in percent), `ppm` or `mg/kg` (1 % = 10 000), `ppb`, `µg/kg` or `ug/kg` (1 % = 10 000 000), `fraction` (a plain mass fraction: 0.01 = 1 %); converted exactly to %.';

/** A unit field; `description` says what it is the unit of, the accepted spellings are added. */
export function unitInput(description: string) {
  return z
    .enum(UNIT_SPELLINGS)
    .transform((spelling): Unit => parseUnit(spelling)!)
    .openapi({ description: `${description} ${SPELLINGS_NOTE}` });
}
