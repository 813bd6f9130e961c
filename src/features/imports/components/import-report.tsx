import { Link } from 'react-router';
import { Card } from '../../../components/ui/layout.tsx';
import { formatBytes } from '../../../lib/format-bytes.ts';
import { useInstruments, useMethods } from '../../../api/lookups.ts';
import type { Import } from '../api/imports.ts';
import { FlagSummary, type FlagLabel } from './flag-summary.tsx';
import { IssuesSection } from './import-issues-table.tsx';
import { LayoutSummary } from './layout-summary.tsx';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

const MODE_WORDS: Record<Import['mode'], string> = {
  all_or_nothing: 'Whole file or nothing: every line could be read',
  per_sample: 'Sample by sample: samples with a line that cannot be read were left out',
};

function rawFileHref(importId: string): string {
  return `/api/v1/imports/${encodeURIComponent(importId)}/file`;
}

/** The stored report of one import: what was created, what was left out and why, and the file. */
export function ImportReportView({ record, flagLabel }: { record: Import; flagLabel?: FlagLabel }) {
  const instrument = useInstruments().data?.find((i) => i.id === record.instrument_id);
  const method = useMethods().data?.find((m) => m.id === record.method_id);
  const { counts } = record.report;
  return (
    <div className="space-y-5" data-testid="import-report">
      <LayoutSummary
        layout={record.report.layout}
        counts={[
          ['Data rows', counts.rows],
          ['Samples created', counts.samples_created],
          ['Burns', counts.burns],
          ['Values', counts.values],
          ['Samples left out', counts.samples_rejected],
          ['Lines rejected', counts.lines_rejected],
        ]}
      />
      <Card title="File">
        <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1.5 text-sm">
          <dt className="text-slag-500">Name</dt>
          <dd className="break-all">
            {record.file.name} <span className="text-slag-500">({formatBytes(record.file.size_bytes)})</span>
          </dd>
          <dt className="text-slag-500">SHA-256</dt>
          <dd className="break-all font-mono text-xs">{record.file.sha256}</dd>
          <dt className="text-slag-500">Instrument</dt>
          <dd className="font-mono">{instrument?.code ?? record.instrument_id}</dd>
          <dt className="text-slag-500">Method</dt>
          <dd className="font-mono">{method?.code ?? record.method_id}</dd>
          <dt className="text-slag-500">Imported</dt>
          <dd>{MODE_WORDS[record.mode]}</dd>
          <dt className="text-slag-500">Uploaded</dt>
          <dd>
            <Timestamp value={record.created_at} seconds className="font-mono text-xs" /> by {record.created_by}
          </dd>
        </dl>
        <div className="mt-3 flex flex-wrap gap-4 text-sm">
          <a href={rawFileHref(record.id)} download className="text-copper-700 underline">
            ⤓ Download the raw file
          </a>
          {counts.samples_created > 0 && (
            <Link to={paths.samplesOfImport(record.id)} className="text-copper-700 underline">
              Open {counts.samples_created === 1 ? 'its sample' : `its ${counts.samples_created} samples`} in the samples table
            </Link>
          )}
        </div>
      </Card>
      <FlagSummary record={record} flagLabel={flagLabel} />
      <IssuesSection title="Lines left out" issues={record.report.rejected} testId="report-rejected" />
      <IssuesSection title="Warnings" issues={record.report.warnings} testId="report-warnings" />
    </div>
  );
}
