import { Link } from 'react-router';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { LoadMore } from '../../../components/ui/load-more.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { useInstruments } from '../../../api/lookups.ts';
import { useImports } from '../api/imports.ts';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { formatInstant } from '../../../lib/timestamp.ts';

const figure = 'px-3 py-2 text-right font-mono tabular-nums';
const right = (text: string) => (
  <span key={text} className="block text-right">
    {text}
  </span>
);

export function ImportsTable() {
  const imports = useImports();
  const instruments = useInstruments().data;
  const rows = imports.data?.pages.flatMap((page) => page.data) ?? [];
  return (
    <div className="space-y-3">
      <ProblemAlert error={imports.error} />
      {imports.isPending && <Spinner label="Loading imports…" />}
      {!imports.isPending && !imports.error && rows.length === 0 && (
        <EmptyState title="No imports yet">Uploaded result files appear here with their reports.</EmptyState>
      )}
      {rows.length > 0 && (
        <Table
          caption="Imports, newest first"
          head={['Uploaded', 'File', 'Instrument', right('Samples'), right('Burns'), right('Rejected lines'), right('Warnings'), 'By', '']}
        >
          {rows.map((record) => (
            <tr key={record.id} className="align-top hover:bg-ash-50" data-testid="import-row">
              <td className="whitespace-nowrap px-3 py-2 font-mono text-xs">
                <Timestamp value={record.created_at} />
              </td>
              <td className="max-w-xs break-words px-3 py-2">{record.file.name}</td>
              <td className="px-3 py-2 font-mono">
                {instruments?.find((i) => i.id === record.instrument_id)?.code ?? record.instrument_id}
              </td>
              <td className={figure}>{record.report.counts.samples_created}</td>
              <td className={figure}>{record.report.counts.burns}</td>
              <td className={figure}>{record.report.counts.lines_rejected}</td>
              <td className={figure}>{record.report.warnings.length}</td>
              <td className="px-3 py-2 text-xs">{record.created_by}</td>
              <td className="px-3 py-2 text-right">
                <Link
                  to={paths.import(record.id)}
                  className="text-copper-700 underline"
                  aria-label={`Report of ${record.file.name}, uploaded ${formatInstant(record.created_at)}`}
                >
                  Report
                </Link>
              </td>
            </tr>
          ))}
        </Table>
      )}
      <LoadMore list={imports} />
    </div>
  );
}
