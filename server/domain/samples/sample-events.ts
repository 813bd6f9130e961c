// sample.created events, recorded in the transaction that stores the samples. Each event's data is
// the sample exactly as GET /samples/{id} returns it (in %), so a receiver needs no call back. It
// is built from the rows being inserted rather than read back one by one: a file import stores
// thousands of samples in one transaction, and three queries per sample would dominate it.
import type { Transaction } from '../../db/transaction.ts';
import { recordEvents } from '../events/events.repository.ts';
import { findImportMeta, type ImportMeta } from '../imports/imports.repository.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { findMethod } from '../methods/methods.repository.ts';
import type { BurnRow, SampleRow } from './samples.repository.ts';
import { toSampleDetail } from './sample-view.ts';

/** Loads each distinct key once, into a map. */
async function loadAll<T>(keys: (string | null)[], load: (key: string) => Promise<T>): Promise<Map<string, T>> {
  const distinct = [...new Set(keys.filter((k): k is string => k !== null))];
  return new Map(await Promise.all(distinct.map(async (key) => [key, await load(key)] as const)));
}

export async function recordSamplesCreated(trx: Transaction, built: { sample: SampleRow; burns: BurnRow[] }[]): Promise<void> {
  if (built.length === 0) return;
  const samples = built.map((b) => b.sample);
  const instruments = await loadAll(
    samples.map((s) => s.instrument_id),
    async (id) => (await findInstrument(trx, id))?.code ?? '',
  );
  const methods = await loadAll(
    samples.map((s) => s.method_id),
    async (id) => (await findMethod(trx, id))?.code ?? '',
  );
  const imports = await loadAll(
    samples.map((s) => s.import_id),
    (id): Promise<ImportMeta | undefined> => findImportMeta(trx, id),
  );
  const events = built.map(({ sample, burns }) => {
    const row = {
      ...sample,
      instrument_code: instruments.get(sample.instrument_id)!,
      method_code: methods.get(sample.method_id)!,
      burn_count: burns.length,
    };
    const ordered = [...burns].sort((a, b) => a.burn_number - b.burn_number);
    const importMeta = sample.import_id ? imports.get(sample.import_id) : undefined;
    return {
      type: 'sample.created' as const,
      data: toSampleDetail(row, ordered, importMeta, '%'),
      occurredAt: sample.created_at,
      instrumentId: sample.instrument_id,
    };
  });
  await recordEvents(trx, events);
}
