// Loading one sample as the caller may see it: a key restricted to instruments sees only theirs.
import type { Queryable } from '../../db/transaction.ts';
import { NotFoundProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { findSample } from './samples.repository.ts';

/** Whether the caller may see the sample: a key restricted to instruments sees only theirs. */
export function isSampleVisible(auth: AuthContext, sample: { instrument_id: string }): boolean {
  return !auth.instrumentIds || auth.instrumentIds.includes(sample.instrument_id);
}

export async function loadSample(db: Queryable, auth: AuthContext, id: string) {
  const sample = await findSample(db, id);
  if (!sample || !isSampleVisible(auth, sample)) throw new NotFoundProblem(`No sample ${id}.`);
  return sample;
}
