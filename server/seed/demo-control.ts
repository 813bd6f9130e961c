// Six weeks of invented control charts, one control piece per demo instrument, sparked twice a
// shift day (not on Sundays). Points go through the same storing and judging code as a JSON push,
// so their rule violations, status changes and events are real. The story the charts tell:
// OES-1's C point beyond 3σ (an electrode worn) and OES-2's Mg run of eight above the centre line
// (an argon purge leaking), each followed by a disposition from the lab manager. Elsewhere the noise
// stays within ±0.9σ and runs and trends are broken before they reach a rule, so nothing else
// breaks a rule. Readings are built so that the correction in force turns them into the planned
// value: reading = (planned − β)/α. All numbers are invented.
import type { Db } from '../db/knex.ts';
import { inTransaction } from '../db/transaction.ts';
import { SYSTEM_ACTOR } from '../domain/audit/actor.ts';
import { sessionAuthContext } from '../domain/auth/auth.service.ts';
import { recordDisposition } from '../domain/control/control-status.ts';
import { createControlSample } from '../domain/control/control.service.ts';
import { type CorrectionTimeline, timelineLoader } from '../domain/drift/correction-timeline.ts';
import type { InstrumentRow } from '../domain/instruments/instruments.repository.ts';
import type { Method } from '../domain/methods/methods.repository.ts';
import { buildSampleRows, type NewBurn } from '../domain/samples/sample-builder.ts';
import { storeNewSamples } from '../domain/samples/samples.service.ts';
import { findUserByEmail } from '../domain/users/users.repository.ts';
import type { DemoLab } from './demo-lab.ts';
import { generator } from './demo-samples.ts';

const DAY = 24 * 3600_000;
const WEEKS = 6;
/** Two a shift day, six shift days a week. */
const POINTS = WEEKS * 6 * 2;
const MANAGER_EMAIL = 'lena.marsh@kestrelbend.test';

interface Special {
  element: string;
  /** Index of the first planned point and the z (in σ) of each. */
  at: number;
  z: number[];
  cause: string;
  action: string;
}

interface ControlPlan {
  instrument: InstrumentRow;
  method: Method;
  code: string;
  description: string;
  /** Element → [centre, sd] in %. */
  limits: Record<string, [number, number]>;
  special: Special;
  seed: number;
}

function plans(lab: DemoLab): ControlPlan[] {
  return [
    {
      instrument: lab.foundry,
      method: lab.feMethod,
      code: 'KB-CTRL-FE1',
      description: 'In-house low-alloy steel control piece, cut from one forged bar',
      limits: { C: [0.412, 0.0045], Si: [0.268, 0.0035], Mn: [0.815, 0.006] },
      special: {
        element: 'C',
        at: 45,
        z: [3.7],
        cause: 'Electrode worn: C read high on the afternoon control',
        action: 'Electrode re-gapped and cleaned, control re-run in control',
      },
      seed: 7301,
    },
    {
      instrument: lab.castHouse,
      method: lab.alMethod,
      code: 'KB-CTRL-AL1',
      description: 'In-house 6063 billet slice, homogenised',
      limits: { Si: [0.452, 0.004], Fe: [0.196, 0.003], Mg: [0.548, 0.005] },
      special: {
        element: 'Mg',
        at: 52,
        z: [0.5, 0.8, 0.4, 0.7, 0.3, 0.6, 0.45, 0.75],
        cause: 'Argon purge leaking at the spark stand: Mg drifting high',
        action: 'Argon line fitting replaced, stand purged, control re-run in control',
      },
      seed: 5519,
    },
  ];
}

/** Planned z per point and element: noise within ±0.9σ, runs of five on one side and trends of four broken. */
function plannedZ(count: number, random: () => number, special: Special | undefined): number[] {
  const z: number[] = [];
  for (let i = 0; i < count; i++) {
    const planned = special && i >= special.at && i < special.at + special.z.length ? special.z[i - special.at] : undefined;
    if (planned !== undefined) {
      z.push(planned);
      continue;
    }
    let next = (0.15 + random() * 0.75) * (random() < 0.5 ? -1 : 1);
    const recent = z.slice(-5);
    // The point after a planned run goes to the other side, so the run ends at eight.
    if (recent.length === 5 && recent.every((v) => Math.sign(v) === Math.sign(recent[0]))) next = -Math.sign(recent[0]) * Math.abs(next);
    const last4 = z.slice(-4);
    const steps = last4.slice(1).map((v, k) => Math.sign(v - last4[k]));
    if (last4.length === 4 && steps.every((s) => s === steps[0]) && Math.sign(next - last4[3]) === steps[0])
      next = last4[3] - steps[0] * 0.2;
    // The point before a planned run is on the other side, so the run is exactly as long as planned.
    if (special && i === special.at - 1) next = -Math.sign(special.z[0]) * Math.abs(next);
    z.push(next);
  }
  return z;
}

/** The last six weeks of shift-day measurement times before now, oldest first: 06:40 and 14:40
 * UTC, Sundays off — always the same number of points (72), whatever the time of day. */
function measurementTimes(now: Date): Date[] {
  const times: Date[] = [];
  const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
  for (let day = today; times.length < POINTS; day -= DAY) {
    if (new Date(day).getUTCDay() === 0) continue;
    for (const minutes of [14 * 60 + 40, 6 * 60 + 40]) {
      const at = new Date(day + minutes * 60_000);
      if (at < now && times.length < POINTS) times.push(at);
    }
  }
  return times.reverse();
}

function burnsFor(
  plan: ControlPlan,
  values: Record<string, number>,
  at: Date,
  timeline: CorrectionTimeline,
  random: () => number,
): NewBurn[] {
  const set = timeline.at(at.toISOString());
  return [0, 1].map((i) => {
    const burn: NewBurn = { burn_number: i + 1, measured_at: new Date(at.getTime() + i * 45_000).toISOString(), values: {}, raw: {} };
    // Two burns a little apart, symmetric, so their mean is the planned value.
    const spread = (random() - 0.5) * 0.002 * (i === 0 ? 1 : -1);
    for (const [element, planned] of Object.entries(values)) {
      const correction = set?.corrections.get(element);
      const corrected = planned * (1 + spread);
      const reading = correction ? (corrected - Number(correction.offset)) / Number(correction.slope) : corrected;
      const text = reading.toFixed(5);
      burn.values[element] = { v: text, q: null };
      burn.raw[element] = { raw: text, unit: '%' };
    }
    return burn;
  });
}

async function seedPlan(db: Db, plan: ControlPlan, now: Date, times: Date[]): Promise<void> {
  const manager = await findUserByEmail(db, MANAGER_EMAIL);
  if (!manager) throw new Error(`demo seed: no demo user ${MANAGER_EMAIL}`);
  const auth = sessionAuthContext(manager, 'demo-seed');
  const ctx = { db };
  const definition = await createControlSample(ctx, auth, {
    instrument_id: plan.instrument.id,
    method_id: plan.method.id,
    code: plan.code,
    description: plan.description,
    kind: 'in_house',
    baseline_n: 20,
    elements: Object.entries(plan.limits).map(([element, [centre, sd]]) => ({
      element,
      centre: String(centre),
      sd: String(sd),
      source: 'demo: invented, from 25 earlier measurements of the piece',
      valid_from: new Date(now.getTime() - (WEEKS * 7 + 1) * DAY).toISOString(),
    })),
  });
  const random = generator(plan.seed);
  const z = Object.fromEntries(
    Object.keys(plan.limits).map((e) => [e, plannedZ(times.length, random, e === plan.special.element ? plan.special : undefined)]),
  );
  const store = (from: number, to: number) =>
    inTransaction(db, async (trx) => {
      const timeline = await timelineLoader(trx)(plan.instrument.id, plan.method.id);
      const built = times.slice(from, to).map((at, k) => {
        const values = Object.fromEntries(Object.entries(plan.limits).map(([e, [centre, sd]]) => [e, centre + z[e][from + k] * sd]));
        const sample = {
          sample_code: plan.code,
          kind: 'control',
          instrument_id: plan.instrument.id,
          method: plan.method,
          source: 'push' as const,
          created_by_label: 'demo seed',
          burns: burnsFor(plan, values, at, timeline, random),
        };
        return buildSampleRows({ ...sample, corrections: timeline }, new Date(at.getTime() + 3 * 60_000).toISOString());
      });
      await storeNewSamples(trx, built, { ...SYSTEM_ACTOR, label: 'demo seed' }, undefined, {
        controlSampleIds: built.map(() => definition.id),
      });
    });
  // Up to and including the violation, then its disposition, then the rest of the six weeks.
  const violationEnd = plan.special.at + plan.special.z.length;
  await store(0, violationEnd);
  await recordDisposition(ctx, auth, plan.instrument.id, {
    method_id: plan.method.id,
    cause: plan.special.cause,
    action: plan.special.action,
  });
  await store(violationEnd, times.length);
}

export async function seedDemoControl(db: Db, lab: DemoLab, now = new Date()): Promise<void> {
  const times = measurementTimes(now);
  for (const plan of plans(lab)) await seedPlan(db, plan, now, times);
}
