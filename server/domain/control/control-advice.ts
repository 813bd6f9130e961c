// Standardization advice: standardizing an instrument whose control is in control only adds
// variation (ASTM E1329; docs/references.md, "Control charts"). A warning on the new run, not a block.
import type { Queryable } from '../../db/transaction.ts';
import { currentStatus } from './control-status.ts';
import { controlSamplesOf, latestPointAt } from './control.repository.ts';

export interface RunWarning {
  code: 'control_in_control';
  message: string;
}

export async function standardizationAdvice(db: Queryable, instrumentId: string, methodId: string): Promise<RunWarning[]> {
  const definitions = await controlSamplesOf(db, instrumentId, methodId);
  const measured = [];
  for (const d of definitions) {
    const at = await latestPointAt(db, d.id);
    if (at) measured.push({ code: d.code, at });
  }
  if (measured.length === 0) return [];
  if ((await currentStatus(db, instrumentId, methodId)).status !== 'in_control') return [];
  const latest = measured.map((m) => `${m.code} (latest point ${m.at})`).join(', ');
  return [
    {
      code: 'control_in_control',
      message: `The control of this instrument and method is in control: ${latest}. ASTM E1329: standardizing an instrument that is in control only adds variation; consider not activating this run unless your procedure requires it.`,
    },
  ];
}
