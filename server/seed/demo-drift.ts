// A few weeks of invented standardization history per demo instrument: every other day a
// two-point run on the high and low setting-up samples, activated by the lab manager. The
// simulated instrument drifts slowly (a slope creeping away from 1 per element, reset by a
// recalibration), with one run flagged `warn` (its slope moved more than 5 % from the set before)
// and one `fail` per instrument, both left as drafts and re-run. Readings are built so that a
// correction (α, β) turns them back into the nominal values: reading = (nominal − β)/α, plus a
// little burn noise. All numbers are invented.
import type { Db } from '../db/knex.ts';
import { inTransaction } from '../db/transaction.ts';
import { type Actor, SYSTEM_ACTOR } from '../domain/audit/actor.ts';
import { applyActivation } from '../domain/drift/activation.service.ts';
import type { RunMeasurement } from '../domain/drift/compute-run.ts';
import type { ReferenceMaterial } from '../domain/drift/reference-materials.repository.ts';
import { findStandardization } from '../domain/drift/standardizations.repository.ts';
import { storeRun } from '../domain/drift/standardizations.service.ts';
import type { Method } from '../domain/methods/methods.repository.ts';
import type { InstrumentRow } from '../domain/instruments/instruments.repository.ts';
import type { DemoLab } from './demo-lab.ts';
import type { DemoReferences } from './demo-references.ts';
import { generator } from './demo-samples.ts';

const DAY = 24 * 3600_000;
/** Activations are recorded as the demo lab manager's, through the seed. */
const MANAGER: Actor = { ...SYSTEM_ACTOR, label: 'lena.marsh@kestrelbend.test (demo seed)' };
const ANALYST: Actor = { ...SYSTEM_ACTOR, label: 'omar.reyes@kestrelbend.test (demo seed)' };

interface PlannedRun {
  daysAgo: number;
  /** An element read as if its true slope were this (the flagged runs). */
  special?: { element: string; slope: number };
  /** An element read exactly on both references' nominal values: its correction is slope 1, offset 0. */
  onNominal?: string;
  activate: boolean;
  note?: string;
  override?: string;
}

interface Plan {
  instrument: InstrumentRow;
  method: Method;
  high: ReferenceMaterial;
  low: ReferenceMaterial;
  /** Days ago the instrument was recalibrated: the simulated slopes start again from 1. */
  recalibrated: number[];
  runs: PlannedRun[];
  seed: number;
}

function every(days: number[], extra: Record<number, Partial<PlannedRun>> = {}): PlannedRun[] {
  return days.map((daysAgo) => ({ daysAgo, activate: true, ...extra[daysAgo] }));
}

function plans(lab: DemoLab, refs: DemoReferences): Plan[] {
  return [
    {
      instrument: lab.foundry,
      method: lab.feMethod,
      high: refs['KB-FE-HI'],
      low: refs['KB-FE-LO'],
      recalibrated: [29, 15],
      seed: 2604,
      runs: every([27, 25, 23, 21, 19, 17, 13, 11, 9, 7.1, 7, 5, 3, 1], {
        19: {
          special: { element: 'C', slope: 1.04 },
          activate: false,
          note: 'C moved 6 % after the argon bottle change; left as a draft, the next run checks it',
        },
        7.1: { special: { element: 'B', slope: 0.45 }, activate: false, note: 'B far off: electrode not cleaned' },
        7: { note: 'Re-run after cleaning the electrode' },
        1: { onNominal: 'C', note: 'C read on its nominal values at both levels' },
      }),
    },
    {
      instrument: lab.castHouse,
      method: lab.alMethod,
      high: refs['KB-AL-HI'],
      low: refs['KB-AL-LO'],
      recalibrated: [28, 14],
      seed: 1187,
      runs: every([26, 24, 22, 20.1, 20, 18, 16, 12, 10.1, 10, 8, 6, 4, 2], {
        20.1: { special: { element: 'Mg', slope: 0.93 }, activate: false, note: 'Mg moved 6 % low; re-sparked both samples' },
        20: { note: 'Re-run' },
        10.1: { special: { element: 'Pb', slope: 1.62 }, activate: false, note: 'Pb channel unstable' },
        10: { note: 'Re-run after warming up' },
      }),
    },
  ];
}

/** Digits kept in a simulated reading: more for trace levels, as instruments print them. */
function digitsFor(value: number): number {
  return value < 0.001 ? 6 : value < 0.01 ? 5 : 4;
}

function simulate(
  plan: Plan,
  run: PlannedRun,
  random: () => number,
  drift: Map<string, { rate: number; offset: number }>,
): RunMeasurement[] {
  const age = Math.min(...plan.recalibrated.filter((d) => d >= run.daysAgo)) - run.daysAgo;
  const truth = new Map<string, { slope: number; offset: number }>();
  for (const { element } of plan.method.elements) {
    const d = drift.get(element)!;
    const slope = run.special?.element === element ? run.special.slope : 1 + d.rate * age + (random() - 0.5) * 0.004;
    const low = Number(plan.low.values.find((v) => v.element === element)?.nominal ?? 0);
    truth.set(element, { slope, offset: d.offset * low });
  }
  return [plan.high, plan.low].map((reference) => ({
    reference,
    burns: [0, 1, 2].map(() => {
      const values: RunMeasurement['burns'][number]['values'] = {};
      const raw: RunMeasurement['burns'][number]['raw'] = {};
      for (const { element, nominal } of reference.values) {
        const t = truth.get(element);
        if (!t) continue;
        const reading = ((Number(nominal) - t.offset) / t.slope) * (1 + (random() - 0.5) * 0.003);
        const text = run.onNominal === element ? nominal : reading.toFixed(digitsFor(reading));
        values[element] = { v: text.replace(/0+$/, '').replace(/\.$/, ''), q: null };
        raw[element] = { raw: text, unit: '%' };
      }
      return { values, raw };
    }),
  }));
}

export async function seedDemoDrift(db: Db, lab: DemoLab, refs: DemoReferences, now: Date): Promise<number> {
  let count = 0;
  for (const plan of plans(lab, refs)) {
    const random = generator(plan.seed);
    const drift = new Map(
      plan.method.elements.map(({ element }) => [element, { rate: (random() - 0.4) * 0.009, offset: (random() - 0.5) * 0.04 }]),
    );
    for (const run of plan.runs) {
      const measuredAt = new Date(now.getTime() - run.daysAgo * DAY - 2 * 3600_000);
      const measurements = simulate(plan, run, random, drift);
      await inTransaction(db, async (trx) => {
        const id = await storeRun(trx, {
          instrumentId: plan.instrument.id,
          method: plan.method,
          mode: 'two_point',
          measurements,
          measuredAt: measuredAt.toISOString(),
          note: run.note ?? null,
          actor: ANALYST,
          now: new Date(measuredAt.getTime() + 5 * 60_000).toISOString(),
        });
        if (run.activate) {
          const row = (await findStandardization(trx, id))!;
          await applyActivation(
            trx,
            row,
            { override_reason: run.override },
            { actor: MANAGER, now: new Date(measuredAt.getTime() + 25 * 60_000).toISOString() },
          );
        }
      });
      count += 1;
    }
  }
  return count;
}
