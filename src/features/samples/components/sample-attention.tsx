// The top of the sample page: what needs someone to look before the results are used — burns that
// disagree, results withheld or outside the working range, values below 0 after correction, an
// out-of-spec or undecidable verdict — problems first. A trace element reported as "<" its limit
// is normal and is said quietly, apart from the list.
import type { ReactNode } from 'react';
import type { ElementResult, Sample } from '../api/samples.ts';
import { reportedFigure, statistic } from '../figures.ts';
import { byTone, flagInfo, needsAttention } from '../result-flags.ts';
import { FlagBadge } from './flag-badges.tsx';

/** What to do about each flag that needs attention, in a few words (common practice, no source). */
const NEXT_STEP: Partial<Record<string, string>> = {
  repeatability_exceeded: 'Exclude the burn that disagrees, with a reason, or spark the sample again.',
  mixed_qualified_burns: 'Spark the sample again.',
  conflicting_qualified_burns: 'Spark the sample again.',
  limit_missing: "Spark again, or set the element's limits in the method.",
  below_zero: 'Check the drift correction in force for this instrument and method.',
  negative_after_correction: 'Check the drift correction in force for this instrument and method.',
  above_working_range: "The value is beyond the method's calibration: measure it with a method that covers it.",
  burns_outside_working_range: "A burn is beyond the method's calibration: check that burn.",
  single_burn: 'Spark again to check that two burns agree.',
  sum_above_100: "Check the burns, the file's units and the method.",
  not_in_method: 'Add the element to the method if it should be reported.',
};

type Verdict = NonNullable<Sample['conformance']>['elements'][number];

function elementDetail(result: ElementResult, flag: string): string {
  const reported = result.reported === null ? 'nothing reported' : reportedFigure(result);
  if (flag === 'repeatability_exceeded' && result.repeatability) {
    const { range, critical_range } = result.repeatability;
    return `${result.element}: burns span ${statistic(range, result.decimals)} ${result.unit}, more than the critical range ${statistic(critical_range, result.decimals)} ${result.unit}`;
  }
  return `${result.element} (${reported})`;
}

function Item({ badge, children, testId }: { badge: ReactNode; children: ReactNode; testId: string }) {
  return (
    <li className="flex flex-wrap items-baseline gap-x-3 gap-y-1" data-attention={testId}>
      {badge}
      <span className="text-sm text-slag-800">{children}</span>
    </li>
  );
}

function verdictWords(e: Verdict): string {
  const value = e.value ?? '—';
  if (e.verdict === 'above_max') return `${e.element} ${value} above the maximum ${e.limit_max}`;
  if (e.verdict === 'below_min') return `${e.element} ${value} below the minimum ${e.limit_min}`;
  if (e.verdict === 'not_measured') return `${e.element} not measured`;
  return `${e.element} ${value} cannot be judged against ${[e.limit_min && `min ${e.limit_min}`, e.limit_max && `max ${e.limit_max}`].filter(Boolean).join(', ')}`;
}

function ConformanceItems({ sample }: { sample: Sample }) {
  const c = sample.conformance;
  if (!c) return null;
  const judged = [...c.elements, ...(c.others?.each ?? [])];
  const out = judged.filter((e) => e.verdict === 'above_max' || e.verdict === 'below_min');
  const undecided = judged.filter((e) => e.verdict === 'undetermined' || e.verdict === 'not_measured');
  return (
    <>
      {out.length > 0 && (
        <Item
          testId="out_of_spec"
          badge={<span className="rounded bg-oxide-600 px-1.5 py-0.5 text-xs font-semibold text-white">⚠ Out of spec</span>}
        >
          Does not conform to {c.grade.code}: {out.map(verdictWords).join('; ')}.
        </Item>
      )}
      {undecided.length > 0 && (
        <Item
          testId="cannot_decide"
          badge={
            <span className="rounded border border-ember-500/40 bg-ember-500/10 px-1.5 py-0.5 text-xs font-medium text-ember-700">
              ? Cannot decide
            </span>
          }
        >
          Against {c.grade.code}: {undecided.map(verdictWords).join('; ')}. Release only as a concession, with a comment.
        </Item>
      )}
    </>
  );
}

export function SampleAttention({ sample }: { sample: Sample }) {
  const byFlag = new Map<string, ElementResult[]>();
  for (const result of sample.results)
    for (const flag of result.flags) if (needsAttention(flag)) byFlag.set(flag, [...(byFlag.get(flag) ?? []), result]);
  for (const flag of sample.flags) if (needsAttention(flag) && !byFlag.has(flag)) byFlag.set(flag, []);
  const flags = [...byFlag.keys()].sort(byTone);
  const outOfSpec = sample.conformance && sample.conformance.conforms !== true;
  const atLimit = sample.results.filter((r) => r.qualifier === '<' && r.flags.every((f) => !needsAttention(f)));
  const nothing = flags.length === 0 && !outOfSpec;
  const problems = flags.some((f) => flagInfo(f).tone === 'problem') || sample.conformance?.conforms === false;

  return (
    <section
      aria-labelledby="attention-heading"
      data-testid="attention"
      className={`rounded-lg border bg-white p-4 ${nothing ? 'border-verdigris-600/40' : problems ? 'border-l-4 border-oxide-600' : 'border-l-4 border-ember-500'}`}
    >
      <h2 id="attention-heading" className="text-base font-semibold text-slag-900">
        {nothing ? '✓ Nothing in the results needs attention' : 'Needs attention before release'}
      </h2>
      {nothing ? (
        <p className="mt-1 text-sm text-slag-700">
          No result is flagged for attention: the burns agree where the method checks repeatability, and every element is inside its working
          range or reported as below a limit{sample.conformance ? `; the sample conforms to ${sample.conformance.grade.code}` : ''}. Review
          and authorise under your laboratory&apos;s procedures as usual.
        </p>
      ) : (
        <ul className="mt-3 space-y-2">
          {flags.map((flag) => {
            const results = byFlag.get(flag)!;
            return (
              <Item key={flag} testId={flag} badge={<FlagBadge name={flag} />}>
                {results.length > 0 && <span className="font-mono">{results.map((r) => elementDetail(r, flag)).join('; ')}. </span>}
                {NEXT_STEP[flag] ?? flagInfo(flag).description}
              </Item>
            );
          })}
          <ConformanceItems sample={sample} />
        </ul>
      )}
      {atLimit.length > 0 && (
        <p className="mt-3 text-xs text-slag-500" data-testid="at-limit">
          Reported below a limit, as usual for trace elements (no action needed):{' '}
          <span className="font-mono">{atLimit.map((r) => `${r.element} ${reportedFigure(r)}`).join(' · ')}</span>
        </p>
      )}
    </section>
  );
}
