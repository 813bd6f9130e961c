// The sample's verdict against its grade: the rule in words, each element by icon and word with
// its value, rounded value, limits and margin, and the caution that release follows the lab's own
// accredited procedures.
import { Alert } from '../../../components/ui/feedback.tsx';
import { Badge, Table } from '../../../components/ui/layout.tsx';
import type { Sample } from '../api/samples.ts';
import { OtherGrades } from './other-grades.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

type Conformance = NonNullable<Sample['conformance']>;
type Verdict = Conformance['elements'][number]['verdict'];

const VERDICTS: Record<Verdict, [icon: string, word: string, tone: 'good' | 'bad' | 'neutral' | 'accent']> = {
  within: ['✓', 'Within', 'good'],
  below_min: ['✕', 'Below minimum', 'bad'],
  above_max: ['✕', 'Above maximum', 'bad'],
  undetermined: ['?', 'Cannot decide', 'accent'],
  not_measured: ['–', 'Not measured', 'neutral'],
};

const RULES: Record<Conformance['decision_rule'], string> = {
  rounding: 'Rounding rule (ASTM E29): each result is rounded half to even, once, to the last place written in the limit, then compared.',
  absolute: 'Absolute rule: each result is compared as measured; any value beyond a limit fails.',
};

function Overall({ conforms }: { conforms: boolean | null }) {
  if (conforms === true) return <Badge tone="good">✓ Conforms</Badge>;
  if (conforms === false) return <Badge tone="bad">✕ Does not conform</Badge>;
  return <Badge tone="accent">? Cannot decide</Badge>;
}

/** The judged value shown to six significant digits (the full value is in its tooltip); bounds as given. */
const shown = (value: string | null) => (value === null ? '—' : /^\d/.test(value) ? String(Number(Number(value).toPrecision(6))) : value);

const limits = (min: string | null, max: string | null) => (min && max ? `${min}–${max}` : max ? `≤ ${max}` : min ? `≥ ${min}` : '');

export function ConformancePanel({ sample }: { sample: Sample }) {
  const c = sample.conformance;
  if (!c) {
    return (
      <p className="text-sm text-slag-500" data-testid="conformance">
        {sample.grade ? `No verdict: the grade ${sample.grade} is not defined in Meltwire.` : 'No verdict: the sample names no grade.'}
      </p>
    );
  }
  return (
    <div className="space-y-3" data-testid="conformance">
      <p className="flex flex-wrap items-center gap-2 text-sm">
        <Overall conforms={c.conforms} />
        <span>
          against <span className="font-mono">{c.grade.code}</span> (version {c.grade.version})
        </span>
      </p>
      <p className="text-xs text-slag-500">{RULES[c.decision_rule]}</p>
      <Table
        head={[
          'Element',
          'Verdict',
          ...['Value (%)', 'Rounded', 'Limits (%)', 'Margin'].map((h) => (
            <span key={h} className="block text-right">
              {h}
            </span>
          )),
        ]}
        caption={`Verdict per element against ${c.grade.code}`}
      >
        {c.elements.map((e) => {
          const [icon, word, tone] = VERDICTS[e.verdict];
          return (
            <tr key={e.element}>
              <th scope="row" className="px-3 py-1.5 font-mono">
                {e.element}
              </th>
              <td className="px-3 py-1.5">
                <Badge tone={tone}>
                  {icon} {word}
                </Badge>
              </td>
              <td className="px-3 py-1.5 text-right font-mono tabular-nums whitespace-nowrap" title={e.value ?? undefined}>
                {shown(e.value)}
              </td>
              <td className="px-3 py-1.5 text-right font-mono tabular-nums whitespace-nowrap">{e.rounded ?? '—'}</td>
              <td className="px-3 py-1.5 text-right font-mono tabular-nums whitespace-nowrap">{limits(e.limit_min, e.limit_max)}</td>
              <td className="px-3 py-1.5 text-right font-mono tabular-nums whitespace-nowrap">{e.margin ?? '—'}</td>
            </tr>
          );
        })}
      </Table>
      {c.remainder && (
        <p className="text-sm">
          {c.remainder.element} by difference: <span className="font-mono">{c.remainder.value}</span> %
          {c.remainder.approximate ? ' (approximate)' : ''}
        </p>
      )}
      {c.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-ember-700">
          {c.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      {c.conforms === false && <OtherGrades sample={sample} />}
      <Alert tone="caution" title="A verdict is not a release">
        Verify the grade&apos;s limits against your licensed copy of the standard. Release follows your laboratory&apos;s accredited review
        and authorisation procedures.
      </Alert>
    </div>
  );
}

export function ReleaseSummary({ sample }: { sample: Sample }) {
  if (!sample.release) return <p className="text-sm text-slag-500">Draft: not released.</p>;
  return (
    <p className="text-sm" data-testid="release">
      Released by {sample.release.by} at <Timestamp value={sample.release.at} seconds className="font-mono" />
      {sample.release.concession && ' as a concession'} · revision {sample.revision}
      {sample.release.comment && <> · “{sample.release.comment}”</>}
    </p>
  );
}
