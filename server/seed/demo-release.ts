// The demo's released results: the lab manager released two final samples; one of them was amended
// afterwards (a burn found to have sparked on a crack), so it carries revision 2 and keeps revision 1.
// Released through the same services as the API, so the audit trail, revisions and events are real.
import type { Db } from '../db/knex.ts';
import { sessionAuthContext } from '../domain/auth/auth.service.ts';
import { amendSample } from '../domain/samples/amendments.service.ts';
import { releaseSample } from '../domain/samples/release.service.ts';
import { findUserByEmail } from '../domain/users/users.repository.ts';

const MANAGER_EMAIL = 'lena.marsh@kestrelbend.test';

export async function seedDemoRelease(db: Db, sampleIds: ReadonlyMap<string, string>): Promise<void> {
  const manager = await findUserByEmail(db, MANAGER_EMAIL);
  if (!manager) throw new Error(`demo seed: no demo user ${MANAGER_EMAIL}`);
  const auth = sessionAuthContext(manager, 'demo-seed');
  // The demo lab requires a second person to release; the seed's samples were pushed by no user.
  const ctx = { db, config: { releaseRequiresSecondPerson: true } };
  const id = (code: string) => {
    const found = sampleIds.get(code);
    if (!found) throw new Error(`demo seed: no demo sample ${code}`);
    return found;
  };
  await releaseSample(ctx, auth, id('K24-0410-F1'), {
    comment: 'Checked against SAE 1045; shipped with the heat.',
    accept_nonconforming: false,
  });
  await releaseSample(ctx, auth, id('K24-0411-F1'), { comment: 'Checked against SAE 1045.', accept_nonconforming: false });
  await amendSample(ctx, auth, id('K24-0411-F1'), {
    reason: 'Burn 3 sparked on a crack found when the sample was re-inspected; result re-issued from burns 1 and 2.',
    exclude_burns: [3],
  });
}
