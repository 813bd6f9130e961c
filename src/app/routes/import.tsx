import { Link, useParams } from 'react-router';
import { ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { useImport } from '../../features/imports/api/imports.ts';
import { ImportReportView } from '../../features/imports/components/import-report.tsx';
import { SamplesTable } from '../../features/samples/components/samples-table.tsx';
import { flagInfo } from '../../features/samples/result-flags.ts';
import { paths } from '../../config/paths.ts';

export function ImportPage() {
  const { id = '' } = useParams();
  const record = useImport(id);
  return (
    <RequireScope scope="samples:read">
      <PageHeader
        title={record.data ? `Import of ${record.data.file.name}` : 'Import'}
        description={<span className="font-mono">{id}</span>}
        actions={
          <Link to={paths.imports} className="text-sm text-copper-700 underline">
            ← All imports
          </Link>
        }
      />
      {record.isPending && <Spinner label="Loading the import report…" />}
      <ProblemAlert error={record.error} />
      {record.data && (
        <div className="space-y-6">
          <ImportReportView record={record.data} flagLabel={(flag) => flagInfo(flag).label} />
          {record.data.report.counts.samples_created > 0 && (
            <section className="space-y-2">
              <h2 className="text-lg font-semibold">Samples of this import</h2>
              <SamplesTable filters={{ import_id: record.data.id }} unit="%" />
            </section>
          )}
        </div>
      )}
    </RequireScope>
  );
}
