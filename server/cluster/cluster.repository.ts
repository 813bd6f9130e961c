// The only code that touches job_leases and cluster_settings (what several nodes share).
import type { Queryable } from '../db/transaction.ts';

/** Records `at` as the job's last run by `node` if its last run started at or before `dueBefore`; true when it did. */
export async function takeJobLease(db: Queryable, job: string, node: string, at: string, dueBefore: string): Promise<boolean> {
  await db('job_leases').insert({ job, last_run_at: null, run_by: null }).onConflict('job').ignore();
  const taken = await db('job_leases')
    .where({ job })
    .andWhere((q) => q.whereNull('last_run_at').orWhere('last_run_at', '<=', dueBefore))
    .update({ last_run_at: at, run_by: node });
  return taken === 1;
}

export interface ClusterSetting {
  value: string;
  set_at: string;
}

/** The setting; stored first with `value` if no node has stored it yet. */
export async function settingOrStore(db: Queryable, key: string, value: string, at: string): Promise<ClusterSetting> {
  await db('cluster_settings').insert({ key, value, set_at: at }).onConflict('key').ignore();
  return (await db('cluster_settings').where({ key }).first()) as ClusterSetting;
}

export async function deleteSetting(db: Queryable, key: string): Promise<void> {
  await db('cluster_settings').where({ key }).delete();
}
