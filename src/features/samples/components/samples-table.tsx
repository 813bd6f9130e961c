import { Link } from 'react-router';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { LoadMore } from '../../../components/ui/load-more.tsx';
import { Badge, Table } from '../../../components/ui/layout.tsx';
import { useSamples, type SampleSummary } from '../api/samples.ts';
import { utcMinute } from '../../../lib/utc-time.ts';
import { reportedFigure } from '../figures.ts';
import type { OutputUnit, SampleFilters } from '../filters.ts';
import { FlagList } from './flag-badges.tsx';
import { StatusBadge } from './status-badge.tsx';
import { paths } from '../../../config/paths.ts';

/** How many reported values the table previews per sample. */
const PREVIEW_ELEMENTS = 3;

/** The first reported values, each element with its value right-aligned in a column of its own width, so rows line up. */
function ResultsPreview({ sample, unit }: { sample: SampleSummary; unit: OutputUnit }) {
  const shown = sample.results.filter((r) => r.reported !== null).slice(0, PREVIEW_ELEMENTS);
  if (shown.length === 0) return <span className="text-xs text-slag-500">no results</span>;
  return (
    <span className="inline-flex gap-3 font-mono text-xs whitespace-nowrap tabular-nums" title={`Reported values in ${unit}`}>
      {shown.map((r) => (
        <span key={r.element} className="inline-flex gap-1">
          <span className="w-5 text-slag-500">{r.element}</span>
          <span className="min-w-[8ch] text-right">{reportedFigure(r)}</span>
        </span>
      ))}
    </span>
  );
}

const cell = 'px-3 py-2 whitespace-nowrap';
const figure = `${cell} text-right font-mono tabular-nums`;

export function SamplesTable({ filters, unit, emptyHint }: { filters: SampleFilters; unit: OutputUnit; emptyHint?: string }) {
  const samples = useSamples(filters, unit);
  const rows = samples.data?.pages.flatMap((page) => page.data) ?? [];
  return (
    <div className="space-y-3">
      <ProblemAlert error={samples.error} />
      {samples.isPending && <Spinner label="Loading samples…" />}
      {!samples.isPending && !samples.error && rows.length === 0 && (
        <EmptyState title="No samples match">{emptyHint ?? 'Try wider filters, or upload a result file.'}</EmptyState>
      )}
      {rows.length > 0 && (
        <Table
          caption="Samples, newest first"
          head={[
            'Sample code',
            'Heat',
            'Grade',
            'Kind',
            'Instrument',
            'Status',
            <span key="b" className="block text-right">
              Burns
            </span>,
            'Flags',
            <span key="reported" className="block text-right">
              Reported ({unit})
            </span>,
            'Created (UTC)',
          ]}
        >
          {rows.map((s) => (
            <tr key={s.id} className="align-top hover:bg-ash-50" data-testid="sample-row">
              <td className={cell}>
                <Link to={paths.sample(s.id, unit)} className="font-mono font-medium text-copper-700 underline">
                  {s.sample_code}
                </Link>
              </td>
              <td className={`${cell} font-mono`}>{s.heat ?? '—'}</td>
              <td className={cell}>{s.grade ?? '—'}</td>
              <td className={cell}>{s.kind ?? '—'}</td>
              <td className={`${cell} font-mono`}>{s.instrument.code}</td>
              <td className={cell}>
                <StatusBadge status={s.status} />
                {s.conformance?.conforms === false && (
                  <span className="ml-1">
                    <Badge tone="bad">✕ Out of spec</Badge>
                  </span>
                )}
                {s.conformance && s.conformance.conforms === null && (
                  <span className="ml-1">
                    <Badge tone="accent">? Cannot decide</Badge>
                  </span>
                )}
              </td>
              <td className={figure}>{s.burn_count}</td>
              <td className="min-w-48 px-3 py-2">
                <FlagList flags={s.flags} empty="none" />
              </td>
              <td className={`${cell} text-right`}>
                <ResultsPreview sample={s} unit={unit} />
              </td>
              <td className={`${cell} whitespace-nowrap font-mono text-xs`}>{utcMinute(s.created_at)}</td>
            </tr>
          ))}
        </Table>
      )}
      <LoadMore list={samples} />
    </div>
  );
}
