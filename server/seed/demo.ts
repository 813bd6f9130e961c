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

/** Seeds the invented demo scenario into an empty database; returns false when it was not empty. */
export async function seedDemoIfEmpty(db: Db): Promise<boolean> {
  if ((await countUsers(db)) > 0) return false;
  await seedDemoUsers(db);
  const lab = await seedDemoLab(db);
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
