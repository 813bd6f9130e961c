import type { Db } from '../db/knex.ts';
import { countUsers } from '../domain/users/users.repository.ts';
import { seedDemoLab } from './demo-lab.ts';
import { seedDemoSamples } from './demo-samples.ts';
import { seedDemoUsers } from './demo-users.ts';

/** Seeds the invented demo scenario into an empty database; returns false when it was not empty. */
export async function seedDemoIfEmpty(db: Db): Promise<boolean> {
  if ((await countUsers(db)) > 0) return false;
  await seedDemoUsers(db);
  const lab = await seedDemoLab(db);
  await seedDemoSamples(db, lab);
  return true;
}
