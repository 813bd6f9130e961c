import type { Db } from '../db/knex.ts';
import { countUsers } from '../domain/users/users.repository.ts';
import { seedDemoControl } from './demo-control.ts';
import { seedDemoDrift } from './demo-drift.ts';
import { seedDemoGrades } from './demo-grades.ts';
import { seedDemoLab } from './demo-lab.ts';
import { seedDemoReferences } from './demo-references.ts';
import { seedDemoRelease } from './demo-release.ts';
import { seedDemoSamples } from './demo-samples.ts';
import { seedDemoUsers } from './demo-users.ts';
import { prepareStaleDocuments } from '../domain/samples/prepared-documents.ts';
import { storeSampleFields } from '../domain/samples/sample-fields.service.ts';

/** The demo's custom fields (server/seed/demo-samples.ts), in the lab's words. */
const DEMO_SAMPLE_FIELDS = [
  { key: 'furnace', label: 'Furnace', description: 'The melting furnace of the heat (foundry).' },
  { key: 'cast_station', label: 'Casting station', description: 'The billet casting station of the lot (cast house).' },
];

/** Seeds the invented demo scenario into an empty database; returns false when it was not empty. */
export async function seedDemoIfEmpty(db: Db): Promise<boolean> {
  if ((await countUsers(db)) > 0) return false;
  await seedDemoUsers(db);
  const lab = await seedDemoLab(db);
  await storeSampleFields(db, DEMO_SAMPLE_FIELDS);
  await seedDemoGrades(db);
  // Drift history before the samples, so that each demo sample records the set in force when it was measured.
  const now = new Date();
  const references = await seedDemoReferences(db, now);
  await seedDemoDrift(db, lab, references, now);
  const sampleIds = await seedDemoSamples(db, lab, now);
  await seedDemoRelease(db, sampleIds);
  await seedDemoControl(db, lab, now);
  await prepareStaleDocuments(db);
  return true;
}
