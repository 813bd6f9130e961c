// Previews a burn exclusion (or inclusion): the results recomputed exactly as the PATCH would,
// compared element by element with the results stored now — so the analyst is told, before
// confirming, when the change clears a flag (e.g. repeatability exceeded) or moves a reported value.
import type { Queryable } from '../../db/transaction.ts';
import { NotFoundProblem } from '../../lib/problems.ts';
import type { z } from '../../lib/zod.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import type { ResultFlag } from '../chemistry/result-rules.ts';
import { convertResult } from '../chemistry/result-units.ts';
import type { OutputUnit } from '../chemistry/units.ts';
import { conformanceJudge } from '../grades/sample-conformance.ts';
import { findMethod } from '../methods/methods.repository.ts';
import { tooFewIncludedBurns } from './burn-exclusion-rules.ts';
import type { BurnExclusionPreviewSchema } from './burn-exclusion.schemas.ts';
import { decodeResults } from './results-codec.ts';
import { loadSample } from './sample-access.ts';
import { findBurns, type StoredResult } from './samples.repository.ts';
import { resultsOfBurns } from './samples.service.ts';

type Preview = z.input<typeof BurnExclusionPreviewSchema>;

const without = (flags: readonly ResultFlag[], others: readonly ResultFlag[]) => flags.filter((f) => !others.includes(f));

function reportedIn(result: StoredResult | undefined, unit: OutputUnit): string | null {
  if (!result) return null;
  const converted = convertResult(result, unit, result.decimals);
  return converted.reported === null ? null : `${converted.qualifier ?? ''}${converted.reported}`;
}

function elementChanges(before: StoredResult[], after: StoredResult[], unit: OutputUnit): Preview['changes'] {
  const elements = [...new Set([...before, ...after].map((r) => r.element))];
  return elements.flatMap((element) => {
    const was = before.find((r) => r.element === element);
    const will = after.find((r) => r.element === element);
    const change = {
      element,
      reported_before: reportedIn(was, unit),
      reported_after: reportedIn(will, unit),
      flags_cleared: without(was?.flags ?? [], will?.flags ?? []),
      flags_raised: without(will?.flags ?? [], was?.flags ?? []),
    };
    const unchanged = change.reported_before === change.reported_after && !change.flags_cleared.length && !change.flags_raised.length;
    return unchanged ? [] : [change];
  });
}

export async function previewBurnExclusion(
  db: Queryable,
  auth: AuthContext,
  sampleId: string,
  burnNumber: number,
  excluded: boolean,
  unit: OutputUnit,
): Promise<Preview> {
  const sample = await loadSample(db, auth, sampleId);
  const burns = await findBurns(db, sampleId);
  const burn = burns.find((b) => b.burn_number === burnNumber);
  if (!burn) throw new NotFoundProblem(`Sample ${sampleId} has no burn ${burnNumber}.`);
  const method = (await findMethod(db, sample.method_id))!;
  const next = burns.map((b) => (b.id === burn.id ? { ...b, excluded } : b));
  const refusal =
    sample.status === 'released'
      ? `This sample is released; change it with an amendment: POST /api/v1/samples/${sampleId}/amendments.`
      : tooFewIncludedBurns(next, burns, method);
  const before = decodeResults(sample.results_json);
  const after = resultsOfBurns(next, method);
  const beforeFlags = JSON.parse(sample.flags_json) as ResultFlag[];
  const verdict = await conformanceJudge(db)(sample.grade, after.results);
  const unchanged = Boolean(burn.excluded) === excluded;
  return {
    burn: burnNumber,
    excluded,
    allowed: refusal === null,
    refusal,
    min_included_burns: method.reporting.min_included_burns,
    included_burns_after: next.filter((b) => !b.excluded).length,
    unit,
    changes: unchanged ? [] : elementChanges(before, after.results, unit),
    sample_flags_cleared: unchanged ? [] : without(beforeFlags, after.flags),
    sample_flags_raised: unchanged ? [] : without(after.flags, beforeFlags),
    conforms_before: sample.conforms,
    conforms_after: unchanged ? sample.conforms : verdict.conforms,
  };
}
