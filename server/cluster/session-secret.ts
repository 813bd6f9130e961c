// Every node on one database must sign sessions with the same SESSION_SECRET, or a user signed in
// on one node is signed out at random on another. The first node to start stores a fingerprint of
// its secret (an HMAC of a fixed text, which does not reveal the secret); a node whose secret gives
// another fingerprint refuses to start, saying why.
import { createHmac } from 'node:crypto';
import { ConfigError } from '../config.ts';
import type { Queryable } from '../db/transaction.ts';
import { nowIso } from '../lib/time.ts';
import { deleteSetting, settingOrStore } from './cluster.repository.ts';

const KEY = 'session_secret_fingerprint';

export function sessionSecretFingerprint(secret: string): string {
  return createHmac('sha256', secret).update('meltwire session secret fingerprint, version 1').digest('hex');
}

/** Records the fingerprint on first start; throws ConfigError when this node's secret differs. */
export async function checkSessionSecret(db: Queryable, secret: string): Promise<void> {
  const mine = sessionSecretFingerprint(secret);
  const stored = await settingOrStore(db, KEY, mine, nowIso());
  if (stored.value !== mine) {
    throw new ConfigError([
      `SESSION_SECRET: differs from the secret the nodes on this database have used since ${stored.set_at}. Give every node the same SESSION_SECRET. To change it on purpose, stop every node, run \`npm run cli -- forget-session-secret\`, and start them all with the new one (everyone is signed out).`,
    ]);
  }
}

/** For a deliberate change of secret: the next node to start records its own. */
export async function forgetSessionSecret(db: Queryable): Promise<void> {
  await deleteSetting(db, KEY);
}
