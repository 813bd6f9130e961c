// Opaque, time-ordered identifiers: "<prefix>_<ULID>". Ordering by id follows creation order,
// which keeps cursor pagination stable.
import { monotonicFactory } from 'ulid';

const nextUlid = monotonicFactory();

export type IdPrefix = 'usr' | 'ses' | 'tok' | 'aud' | 'key' | 'req' | 'ipr' | 'ins' | 'mth' | 'imp' | 'smp' | 'brn' | 'evt' | 'rfm' | 'std';

export function newId(prefix: IdPrefix): string {
  return `${prefix}_${nextUlid().toLowerCase()}`;
}
