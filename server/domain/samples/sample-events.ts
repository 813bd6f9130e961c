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

/** Looks each key up once. */
function once<T>(load: (key: string) => Promise<T>): (key: string) => Promise<T> {
  const seen = new Map<string, Promise<T>>();
  return (key) => {
    if (!seen.has(key)) seen.set(key, load(key));
    return seen.get(key)!;
  };
}

export async function recordSamplesCreated(trx: Transaction, built: { sample: SampleRow; burns: BurnRow[] }[]): Promise<void> {
  if (built.length === 0) return;
  const instrumentCode = once(async (id) => (await findInstrument(trx, id))?.code ?? '');
  const methodCode = once(async (id) => (await findMethod(trx, id))?.code ?? '');
  const importOf = once((id): Promise<ImportMeta | undefined> => findImportMeta(trx, id));
  const events = [];
  for (const { sample, burns } of built) {
    const row = {
      ...sample,
      instrument_code: await instrumentCode(sample.instrument_id),
      method_code: await methodCode(sample.method_id),
      burn_count: burns.length,
    };
    const ordered = [...burns].sort((a, b) => a.burn_number - b.burn_number);
    const importMeta = sample.import_id ? await importOf(sample.import_id) : undefined;
    events.push({
      type: 'sample.created' as const,
      data: toSampleDetail(row, ordered, importMeta, '%'),
      occurredAt: sample.created_at,
      instrumentId: sample.instrument_id,
    });
  }
  await recordEvents(trx, events);
}
