import { Link } from 'react-router';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { LoadMore } from '../../../components/ui/load-more.tsx';
import { Badge } from '../../../components/ui/layout.tsx';
import { useSamples, type SampleSummary } from '../api/samples.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { reportedFigure } from '../figures.ts';
import type { OutputUnit, SampleFilters } from '../filters.ts';
import { FlagList } from './flag-badges.tsx';
import { needsAttention, flagInfo } from '../result-flags.ts';
import { ScrollingTable } from './scrolling-table.tsx';
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

/**
 * The flags that need someone to look, in full; the notes (a "<" trace element, a balance by
 * difference) folded into a quiet count with their names on hover, so that a normal sample reads as one.
 */
function AttentionFlags({ flags }: { flags: string[] }) {
  const attention = flags.filter(needsAttention);
  const notes = flags.filter((f) => !needsAttention(f));
  return (
    <span className="flex flex-wrap items-center gap-1">
      {attention.length > 0 ? <FlagList flags={attention} /> : <span className="text-xs text-slag-500">none</span>}
      {notes.length > 0 && (
        <span className="text-xs text-slag-400" title={notes.map((f) => flagInfo(f).label).join('\n')} data-testid="note-count">
          + {notes.length} {notes.length === 1 ? 'note' : 'notes'}
        </span>
      )}
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
        <ScrollingTable
          label="Samples"
          caption="Samples, newest first"
          head={[
            'Sample code',
            'Heat',
            'Grade',
            'Kind',
            'Status',
            'Needs attention',
            <span key="b" className="block text-right">
              Burns
            </span>,
            <span key="reported" className="block text-right">
              Reported ({unit})
            </span>,
            'Instrument',
            'Created (UTC)',
          ]}
        >
          {rows.map((s) => (
            <tr key={s.id} className="bg-white align-top hover:bg-ash-50" data-testid="sample-row">
              <td className={`${cell} sticky left-0 z-10 bg-inherit shadow-[1px_0_0_var(--color-ash-200)]`}>
                <Link to={paths.sample(s.id, unit)} className="font-mono font-medium text-copper-700 underline">
                  {s.sample_code}
                </Link>
              </td>
              <td className={`${cell} font-mono`}>{s.heat ?? '—'}</td>
              <td className={cell}>{s.grade ?? '—'}</td>
              <td className={cell}>{s.kind ?? '—'}</td>
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
              <td className="min-w-48 px-3 py-2">
                <AttentionFlags flags={s.flags} />
              </td>
              <td className={figure}>{s.burn_count}</td>
              <td className={`${cell} text-right`}>
                <ResultsPreview sample={s} unit={unit} />
              </td>
              <td className={`${cell} font-mono`}>{s.instrument.code}</td>
              <td className={`${cell} whitespace-nowrap font-mono text-xs`}>
                <Timestamp value={s.created_at} />
              </td>
            </tr>
          ))}
        </ScrollingTable>
      )}
      <LoadMore list={samples} />
    </div>
  );
}
