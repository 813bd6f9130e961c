// The invented Kestrel Bend Metals laboratory: two instruments, a Fe-base and an Al-base
// method. Every number here is invented for the demo (plausible, not from any real lab).
import type { Db } from '../db/knex.ts';
import { inTransaction } from '../db/transaction.ts';
import { SYSTEM_ACTOR } from '../domain/audit/actor.ts';
import { recordAudit } from '../domain/audit/audit.repository.ts';
import { insertInstrument, type InstrumentRow } from '../domain/instruments/instruments.repository.ts';
import { insertMethod, type Method, type MethodElement } from '../domain/methods/methods.repository.ts';
import { DEFAULT_DRIFT_LIMITS, DEFAULT_REPORTING } from '../domain/methods/methods.schemas.ts';
import { newId } from '../lib/ids.ts';
import { nowIso } from '../lib/time.ts';

type Setting = [element: string, decimals: number, low: string, high: string, detection: string, sigmaR: string];

function elements(settings: Setting[]): MethodElement[] {
  return settings.map(([element, decimals, low, high, detection, sigmaR]) => ({
    element,
    decimals,
    working_range_low: low,
    working_range_high: high,
    detection_limit: detection,
    repeatability_sd: sigmaR,
  }));
}

// Invented demo settings: element, decimals, working range, detection limit, σr (all %).
const FE_LOW_ALLOY: Setting[] = [
  ['C', 3, '0.003', '1.200', '0.0015', '0.004'],
  ['Si', 2, '0.005', '1.50', '0.002', '0.006'],
  ['Mn', 2, '0.010', '2.00', '0.003', '0.008'],
  ['P', 3, '0.002', '0.100', '0.0010', '0.0015'],
  ['S', 3, '0.002', '0.100', '0.0010', '0.0015'],
  ['Cr', 2, '0.005', '3.00', '0.002', '0.006'],
  ['Ni', 2, '0.005', '5.00', '0.002', '0.006'],
  ['Mo', 2, '0.002', '1.50', '0.001', '0.004'],
  ['Cu', 2, '0.005', '1.00', '0.002', '0.004'],
  ['Al', 3, '0.002', '0.200', '0.0010', '0.0015'],
  ['V', 3, '0.002', '0.500', '0.0010', '0.0015'],
  ['Ti', 3, '0.002', '0.300', '0.0010', '0.0015'],
  ['Nb', 3, '0.003', '0.200', '0.0015', '0.0015'],
  ['B', 4, '0.0003', '0.0100', '0.0002', '0.0002'],
  ['Sn', 3, '0.002', '0.100', '0.0010', '0.0010'],
];

const AL_WROUGHT: Setting[] = [
  ['Si', 2, '0.010', '1.50', '0.003', '0.006'],
  ['Fe', 2, '0.010', '1.20', '0.003', '0.006'],
  ['Cu', 3, '0.002', '1.000', '0.0010', '0.0020'],
  ['Mn', 3, '0.002', '1.000', '0.0010', '0.0020'],
  ['Mg', 2, '0.005', '1.50', '0.002', '0.006'],
  ['Cr', 3, '0.002', '0.400', '0.0010', '0.0015'],
  ['Zn', 3, '0.003', '0.500', '0.0015', '0.0020'],
  ['Ti', 3, '0.002', '0.200', '0.0010', '0.0010'],
  ['Ni', 3, '0.002', '0.100', '0.0010', '0.0010'],
  ['Pb', 3, '0.002', '0.100', '0.0010', '0.0010'],
];

export interface DemoLab {
  foundry: InstrumentRow;
  castHouse: InstrumentRow;
  feMethod: Method;
  alMethod: Method;
}

export async function seedDemoLab(db: Db): Promise<DemoLab> {
  const now = nowIso();
  const foundry: InstrumentRow = {
    id: newId('ins'),
    code: 'OES-1',
    name: 'Melt shop spark stand',
    site: 'Steel foundry, Kestrel Bend',
    created_at: now,
    updated_at: now,
  };
  const castHouse: InstrumentRow = {
    id: newId('ins'),
    code: 'OES-2',
    name: 'Cast house spark stand',
    site: 'Billet cast house, Kestrel Bend',
    created_at: now,
    updated_at: now,
  };
  const feMethod: Method = {
    id: newId('mth'),
    code: 'FE-LA',
    name: 'Low-alloy steel (Fe base)',
    matrix: 'Fe',
    default_unit: '%',
    elements: elements(FE_LOW_ALLOY),
    drift_limits: DEFAULT_DRIFT_LIMITS,
    reporting: DEFAULT_REPORTING,
    created_at: now,
    updated_at: now,
  };
  const alMethod: Method = {
    id: newId('mth'),
    code: 'AL-WR',
    name: 'Wrought aluminium (Al base)',
    matrix: 'Al',
    default_unit: '%',
    elements: elements(AL_WROUGHT),
    drift_limits: DEFAULT_DRIFT_LIMITS,
    // The cast house reports aluminium as the balance, by difference.
    reporting: { ...DEFAULT_REPORTING, balance_by_difference: true },
    created_at: now,
    updated_at: now,
  };
  await inTransaction(db, async (trx) => {
    for (const instrument of [foundry, castHouse]) {
      await insertInstrument(trx, instrument);
      await recordAudit(trx, {
        actor: SYSTEM_ACTOR,
        action: 'instrument.demo_seeded',
        targetType: 'instrument',
        targetId: instrument.id,
        after: instrument,
      });
    }
    for (const method of [feMethod, alMethod]) {
      await insertMethod(trx, method);
      await recordAudit(trx, {
        actor: SYSTEM_ACTOR,
        action: 'method.demo_seeded',
        targetType: 'method',
        targetId: method.id,
        after: method,
      });
    }
  });
  return { foundry, castHouse, feMethod, alMethod };
}
