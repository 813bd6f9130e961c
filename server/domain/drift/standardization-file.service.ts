// Reads the result file in which the reference materials were sparked, with the parser and import
// profiles of the sample import (nothing is stored): each sample's burns in %, limited to the
// method's elements, the reference material its code matches, and the measurement time from the
// file. The console shows this for checking and mapping, then creates the run from these burns.
import type { AppContext } from '../../context.ts';
import { type FieldError, NotFoundProblem, UnprocessableProblem } from '../../lib/problems.ts';
import { sha256Hex } from '../../lib/secrets.ts';
import { latestMeasurementTime } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { fileProblem, findMethodAndProfile } from '../imports/imports.service.ts';
import { FileLayoutError, parseResultFile, type ParsedSample, type ParsedValue } from '../imports/parse/index.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { assertInstrumentAllowed } from '../instruments/instruments.service.ts';
import { listReferenceMaterialsOfMatrix, type ReferenceMaterial } from './reference-materials.repository.ts';
import type { ReadStandardizationFileRequestSchema } from './standardization-file.schemas.ts';

export type StandardizationFileInput = Omit<z.output<typeof ReadStandardizationFileRequestSchema>, 'file'> & {
  file: Express.Multer.File;
};

/** Codes compared the way people write them: case, spaces and separators do not count. */
export function matchKey(code: string): string {
  return code.toLowerCase().replace(/[\s\-_./]+/g, '');
}

/** A parsed cell as a burn value of a standardization request, in %. */
export function asBurnValue(cell: ParsedValue): string {
  if (cell.qualifier === 'nd' || cell.value === null) return 'n.d.';
  return cell.qualifier ? `${cell.qualifier}${cell.value}` : cell.value;
}

function latest(times: (string | null | undefined)[]): string | null {
  return times.reduce<string | null>((max, t) => (t && (!max || t > max) ? t : max), null);
}

function toFileSample(sample: ParsedSample, elements: Set<string>, references: ReferenceMaterial[]) {
  const reference = references.find((r) => matchKey(r.code) === matchKey(sample.sample_code));
  const burns = sample.burns.map((burn) => ({
    line: burn.line,
    burn_number: burn.burn_number,
    measured_at: burn.measured_at ?? null,
    values: Object.fromEntries(
      Object.entries(burn.values)
        .filter(([element]) => elements.has(element))
        .map(([element, cell]) => [element, asBurnValue(cell)]),
    ),
  }));
  return {
    sample_code: sample.sample_code,
    first_line: sample.first_line,
    measured_at: latest(burns.map((b) => b.measured_at)),
    reference_material: reference ? { id: reference.id, code: reference.code, name: reference.name, kind: reference.kind } : null,
    burns,
    rejected: new Set(sample.rejected.map((issue) => issue.line)).size,
  };
}

export async function readStandardizationFile(ctx: AppContext, auth: AuthContext, instrumentId: string, input: StandardizationFileInput) {
  const instrument = await findInstrument(ctx.db, instrumentId);
  if (!instrument) throw new NotFoundProblem(`No instrument ${instrumentId}.`);
  assertInstrumentAllowed(auth, instrumentId);
  const errors: FieldError[] = [];
  const { method, profile } = await findMethodAndProfile(ctx, input, errors);
  if (errors.length || !method) throw new UnprocessableProblem('The request refers to a method or profile that does not exist.', errors);

  let parsed;
  try {
    parsed = parseResultFile(input.file.buffer, { profile, defaultUnit: method.default_unit, latestTime: latestMeasurementTime() });
  } catch (error) {
    if (!(error instanceof FileLayoutError)) throw error;
    throw fileProblem(`The file cannot be read as result data: ${error.message}`, error.issues);
  }
  const elements = new Set(method.elements.map((e) => e.element));
  const inFile = new Set(parsed.columns.flatMap((c) => (c.role === 'element' && c.element ? [c.element] : [])));
  for (const sample of parsed.samples) for (const burn of sample.burns) for (const element in burn.values) inFile.add(element);
  const references = (await listReferenceMaterialsOfMatrix(ctx.db, method.matrix)).filter((r) => r.kind !== 'control');
  const samples = parsed.samples.map((sample) => toFileSample(sample, elements, references));
  const matched = samples.filter((s) => s.reference_material);
  return {
    file: { name: input.file.originalname.slice(0, 255) || 'upload', size_bytes: input.file.size, sha256: sha256Hex(input.file.buffer) },
    method: { id: method.id, code: method.code },
    measured_at: latest((matched.length ? matched : samples).map((s) => s.measured_at)),
    samples,
    elements_not_in_method: [...inFile].filter((e) => !elements.has(e)).sort(),
    missing_elements: [...elements].filter((e) => !inFile.has(e)),
    time_zone: parsed.time_zone,
    warnings: parsed.warnings,
    rejected: parsed.rejected,
  };
}
