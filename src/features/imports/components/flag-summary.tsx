import { Link } from 'react-router';
import { Table } from '../../../components/ui/layout.tsx';
import { paths } from '../../../config/paths.ts';
import type { Import } from '../api/imports.ts';

/** How the console names a result flag (the page passes the samples feature's labels). */
export type FlagLabel = (flag: string) => string;

const plainFlag: FlagLabel = (flag) => flag.replaceAll('_', ' ');

/** The import's result flags per element: how many of its samples carry each, linked to them. */
export function FlagSummary({ record, flagLabel = plainFlag }: { record: Import; flagLabel?: FlagLabel }) {
  const rows = record.report.flag_summary;
  const created = record.report.counts.samples_created;
  if (created === 0) return null;
  return (
    <section className="space-y-2" data-testid="flag-summary">
      <h3 className="text-sm font-semibold text-slag-800">Flags per element</h3>
      {!rows ? (
        <p className="text-sm text-slag-500">
          This import was stored before flag summaries were kept; open its samples to see their flags.
        </p>
      ) : rows.length === 0 ? (
        <p className="text-sm text-slag-500">No result of this import carries a flag.</p>
      ) : (
        <Table
          caption="How many samples of this import carry each flag, per element"
          head={[
            'Element',
            'Flag',
            <span key="n" className="block text-right">
              Samples
            </span>,
            '',
          ]}
        >
          {rows.map((row) => (
            <tr
              key={`${row.element ?? ''}-${row.flag}`}
              data-testid="flag-summary-row"
              data-element={row.element ?? ''}
              data-flag={row.flag}
            >
              <td className="px-3 py-1.5 font-mono">{row.element ?? <span className="font-sans text-slag-500">whole sample</span>}</td>
              <td className="px-3 py-1.5">{flagLabel(row.flag)}</td>
              <td className="px-3 py-1.5 text-right font-mono tabular-nums">
                {row.samples} <span className="text-slag-500">of {created}</span>
              </td>
              <td className="px-3 py-1.5 text-right">
                <Link
                  to={paths.samplesOfImport(record.id, row.flag)}
                  className="text-copper-700 underline"
                  aria-label={`Samples of this import flagged ${flagLabel(row.flag)}`}
                >
                  Samples
                </Link>
              </td>
            </tr>
          ))}
        </Table>
      )}
    </section>
  );
}
