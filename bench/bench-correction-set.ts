// A correction set in force for the ingest bench: the demo's steel setting-up samples sparked
// once (3 burns each, readings 1 % low and 0.001 % high, invented), stored as a two-point run on
// the bench method and activated a day before the file's burns, so every burn of the file is
// corrected for the elements the references carry.
import type { Db } from '../server/db/knex.ts';
import { inTransaction } from '../server/db/transaction.ts';
import { SYSTEM_ACTOR } from '../server/domain/audit/actor.ts';
import { applyActivation } from '../server/domain/drift/activation.service.ts';
import type { RunMeasurement } from '../server/domain/drift/compute-run.ts';
import { findStandardization } from '../server/domain/drift/standardizations.repository.ts';
import { storeRun } from '../server/domain/drift/standardizations.service.ts';
import type { Method } from '../server/domain/methods/methods.repository.ts';
import { seedDemoReferences } from '../server/seed/demo-references.ts';

export async function activateBenchSet(db: Db, instrumentId: string, method: Method, before: Date): Promise<string[]> {
  const references = Object.values(await seedDemoReferences(db, before));
  const inMethod = new Set(method.elements.map((e) => e.element));
  const measurements: RunMeasurement[] = (['high', 'low'] as const).map((kind) => {
    const reference = references.find((r) => r.matrix === 'Fe' && r.kind === kind)!;
    const reading = (nominal: string) => (Number(nominal) * 0.99 + 0.001).toFixed(5);
    const values = Object.fromEntries(
      reference.values.filter((v) => inMethod.has(v.element)).map((v) => [v.element, { v: reading(v.nominal), q: null }]),
    );
    return { reference, burns: [0, 1, 2].map(() => ({ values, raw: {} })) };
  });
  const measuredAt = new Date(before.getTime() - 24 * 3600_000).toISOString();
  await inTransaction(db, async (trx) => {
    const id = await storeRun(trx, {
      instrumentId,
      method,
      mode: 'two_point',
      measurements,
      measuredAt,
      note: 'bench',
      actor: SYSTEM_ACTOR,
      now: measuredAt,
    });
    await applyActivation(
      trx,
      (await findStandardization(trx, id))!,
      { override_reason: 'bench' },
      { actor: SYSTEM_ACTOR, now: measuredAt },
    );
  });
  return Object.keys(measurements[0].burns[0].values);
}
