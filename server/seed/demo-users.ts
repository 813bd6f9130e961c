// Demo users of the invented Kestrel Bend Metals scenario (reserved .test domain).
import type { Db } from '../db/knex.ts';
import { inTransaction } from '../db/transaction.ts';
import { SYSTEM_ACTOR } from '../domain/audit/actor.ts';
import { recordAudit } from '../domain/audit/audit.repository.ts';
import type { Role } from '../domain/auth/scopes.ts';
import { hashPassword, verifyPassword } from '../domain/users/passwords.ts';
import { emailKey, findUserByEmail, insertUser, toUser } from '../domain/users/users.repository.ts';
import { newId } from '../lib/ids.ts';
import { nowIso } from '../lib/time.ts';

/** Printed at start while the demo admin still has it; change it before real use. */
export const DEMO_PASSWORD = 'kestrel-demo-2026';

export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@kestrelbend.test', name: 'Ines Okafor (lab admin)', role: 'admin' },
  { email: 'lena.marsh@kestrelbend.test', name: 'Lena Marsh (lab manager)', role: 'manager' },
  { email: 'omar.reyes@kestrelbend.test', name: 'Omar Reyes (analyst, foundry)', role: 'analyst' },
  { email: 'mes-bridge@kestrelbend.test', name: 'MES bridge (integrator)', role: 'integrator' },
  { email: 'qa.viewer@kestrelbend.test', name: 'Quality viewer', role: 'viewer' },
];

export async function seedDemoUsers(db: Db): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await inTransaction(db, async (trx) => {
    for (const demo of DEMO_USERS) {
      const now = nowIso();
      const row = {
        id: newId('usr'),
        email: demo.email,
        email_key: emailKey(demo.email),
        name: demo.name,
        role: demo.role,
        status: 'active' as const,
        password_hash: passwordHash,
        created_at: now,
        updated_at: now,
        last_login_at: null,
      };
      await insertUser(trx, row);
      await recordAudit(trx, { actor: SYSTEM_ACTOR, action: 'user.demo_seeded', targetType: 'user', targetId: row.id, after: toUser(row) });
    }
  });
}

/** True while the demo admin exists and still signs in with the demo password. */
export async function demoAdminStillDefault(db: Db): Promise<boolean> {
  const row = await findUserByEmail(db, DEMO_USERS[0].email);
  return row?.status === 'active' && (await verifyPassword(DEMO_PASSWORD, row.password_hash));
}
