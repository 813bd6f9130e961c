// Opaque, time-ordered identifiers: "<prefix>_<ULID>". Ordering by id follows creation order,
// which keeps cursor pagination stable.
import { randomFillSync } from 'node:crypto';
import { monotonicFactory } from 'ulid';

// ulid's default generator asks the OS for one random byte per character; a bulk import makes
// tens of thousands of ids, so randomness is drawn from a pooled buffer instead.
const pool = new Uint8Array(4096);
let poolIndex = pool.length;
function pooledRandom(): number {
  if (poolIndex === pool.length) {
    randomFillSync(pool);
    poolIndex = 0;
  }
  return pool[poolIndex++] / 256;
}

const nextUlid = monotonicFactory(pooledRandom);

export type IdPrefix =
  | 'usr'
  | 'ses'
  | 'tok'
  | 'aud'
  | 'key'
  | 'req'
  | 'ipr'
  | 'ins'
  | 'mth'
  | 'imp'
  | 'smp'
  | 'brn'
  | 'evt'
  | 'rfm'
  | 'std'
  | 'whe'
  | 'whd'
  | 'wha'
  | 'grd'
  | 'rev'
  | 'ctl'
  | 'lim'
  | 'cst'
  | 'alr';

export function newId(prefix: IdPrefix): string {
  return `${prefix}_${nextUlid().toLowerCase()}`;
}
