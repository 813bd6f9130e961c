// Where an import's time goes, phase by phase, for the 20,000-burn benchmark file:
// parse → build (results computed, rows serialised) → insert (one transaction).
// Run: npm run bench:phases
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createDb } from '../server/db/knex.ts';
import { migrateLatest } from '../server/db/migrate.ts';
import { buildImportedSamples } from '../server/domain/imports/import-samples.ts';
import { parseResultFile } from '../server/domain/imports/parse/index.ts';
import { insertMethod } from '../server/domain/methods/methods.repository.ts';
import { insertSamples } from '../server/domain/samples/samples.repository.ts';
import { newId } from '../server/lib/ids.ts';
import { seedDemoLab } from '../server/seed/demo-lab.ts';
import { WIDE_FILE_ELEMENTS, wideCsv } from './generate-wide-file.ts';

const dir = mkdtempSync(join(tmpdir(), 'meltwire-phases-'));
const db = createDb({ databaseFile: join(dir, 'phases.db') });
try {
  await migrateLatest(db);
  const lab = await seedDemoLab(db);
  const method = {
    ...lab.feMethod,
    id: newId('mth'),
    code: 'FE-BENCH',
    elements: WIDE_FILE_ELEMENTS.map((element) => ({
      element,
      decimals: 4,
      working_range_low: null,
      working_range_high: null,
      detection_limit: null,
      repeatability_sd: '0.01',
    })),
  };
  await insertMethod(db, method);
  const bytes = Buffer.from(wideCsv(20_000));
  let mark = performance.now();
  const lap = (phase: string) => {
    const now = performance.now();
    console.log(`${phase.padEnd(8)} ${(now - mark).toFixed(0).padStart(6)} ms`);
    mark = now;
  };
  const parsed = parseResultFile(bytes, {});
  lap('parse');
  const built = buildImportedSamples(
    parsed.samples,
    { instrumentId: lab.foundry.id, method, importId: null, createdBy: 'bench', now: new Date().toISOString() },
    [],
  );
  lap('build');
  await db.transaction((trx) =>
    insertSamples(
      trx,
      built.map((b) => b.sample),
      built.flatMap((b) => b.burns),
    ),
  );
  lap('insert');
} finally {
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
}
