// Invented reference materials of the Kestrel Bend lab: a high and a low setting-up sample per
// base (Fe, Al), a type sample close to SAE 1045 and a control sample. Every value is invented.
import type { Db } from '../db/knex.ts';
import { inTransaction } from '../db/transaction.ts';
import { SYSTEM_ACTOR } from '../domain/audit/actor.ts';
import { recordAudit } from '../domain/audit/audit.repository.ts';
import {
  insertReferenceMaterial,
  type ReferenceKind,
  type ReferenceMaterial,
  toReferenceMaterial,
} from '../domain/drift/reference-materials.repository.ts';
import { referenceMaterialRow } from '../domain/drift/reference-materials.service.ts';

type Values = Record<string, string>;

const FE_HIGH: Values = {
  C: '0.812',
  Si: '1.12',
  Mn: '1.502',
  P: '0.048',
  S: '0.041',
  Cr: '2.15',
  Ni: '3.02',
  Mo: '0.92',
  Cu: '0.61',
  Al: '0.121',
  V: '0.32',
  Ti: '0.182',
  Nb: '0.101',
  B: '0.0062',
  Sn: '0.061',
};
const FE_LOW: Values = {
  C: '0.105',
  Si: '0.152',
  Mn: '0.305',
  P: '0.0082',
  S: '0.0065',
  Cr: '0.252',
  Ni: '0.081',
  Mo: '0.021',
  Cu: '0.043',
  Al: '0.012',
  V: '0.0061',
  Ti: '0.0042',
  Nb: '0.0048',
  B: '0.0006',
  Sn: '0.0055',
};
const FE_1045_TYPE: Values = {
  C: '0.458',
  Si: '0.241',
  Mn: '0.738',
  P: '0.012',
  S: '0.018',
  Cr: '0.112',
  Ni: '0.061',
  Mo: '0.021',
  Cu: '0.131',
  Al: '0.027',
  V: '0.0042',
  Ti: '0.0021',
  B: '0.0004',
  Sn: '0.0092',
};
const AL_HIGH: Values = {
  Si: '1.21',
  Fe: '0.92',
  Cu: '0.61',
  Mn: '0.72',
  Mg: '1.32',
  Cr: '0.31',
  Zn: '0.41',
  Ti: '0.152',
  Ni: '0.082',
  Pb: '0.081',
};
const AL_LOW: Values = {
  Si: '0.082',
  Fe: '0.081',
  Cu: '0.012',
  Mn: '0.011',
  Mg: '0.061',
  Cr: '0.0062',
  Zn: '0.012',
  Ti: '0.0081',
  Ni: '0.0052',
  Pb: '0.0048',
};
const AL_CONTROL: Values = { Si: '0.45', Fe: '0.19', Cu: '0.021', Mn: '0.032', Mg: '0.56', Cr: '0.0081', Zn: '0.018', Ti: '0.014' };

const MATERIALS: { code: string; name: string; matrix: string; kind: ReferenceKind; values: Values }[] = [
  { code: 'KB-FE-HI', name: 'Steel setting-up sample, high level', matrix: 'Fe', kind: 'high', values: FE_HIGH },
  { code: 'KB-FE-LO', name: 'Steel setting-up sample, low level', matrix: 'Fe', kind: 'low', values: FE_LOW },
  { code: 'KB-FE-1045T', name: 'Type sample for SAE 1045 heats', matrix: 'Fe', kind: 'type', values: FE_1045_TYPE },
  { code: 'KB-AL-HI', name: 'Aluminium setting-up sample, high level', matrix: 'Al', kind: 'high', values: AL_HIGH },
  { code: 'KB-AL-LO', name: 'Aluminium setting-up sample, low level', matrix: 'Al', kind: 'low', values: AL_LOW },
  { code: 'KB-AL-CTL', name: 'Billet control sample (6063-like)', matrix: 'Al', kind: 'control', values: AL_CONTROL },
];

export type DemoReferences = Record<string, ReferenceMaterial>;

export async function seedDemoReferences(db: Db, now: Date): Promise<DemoReferences> {
  const created: DemoReferences = {};
  const stamp = new Date(now.getTime() - 60 * 24 * 3600_000).toISOString();
  await inTransaction(db, async (trx) => {
    for (const m of MATERIALS) {
      const values = Object.entries(m.values).map(([element, nominal]) => ({ element, nominal, unit: '%' as const }));
      const row = referenceMaterialRow(
        {
          code: m.code,
          name: m.name,
          matrix: m.matrix,
          kind: m.kind,
          values,
          certificate: 'Invented for the demo — in-house values, not a certified reference material',
        },
        'demo seed',
        stamp,
      );
      await insertReferenceMaterial(trx, row);
      await recordAudit(trx, {
        actor: SYSTEM_ACTOR,
        action: 'reference_material.demo_seeded',
        targetType: 'reference_material',
        targetId: row.id,
        after: toReferenceMaterial(row),
      });
      created[m.code] = toReferenceMaterial(row);
    }
  });
  return created;
}
