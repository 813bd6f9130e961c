import { useLocation } from 'react-router';
import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { UploadWizard } from '../../features/imports/components/upload-wizard.tsx';
import { SamplesTable } from '../../features/samples/components/samples-table.tsx';
import { flagInfo } from '../../features/samples/result-flags.ts';

export function UploadPage() {
  // A click on "Upload results" while a report is shown starts a new upload: each navigation remounts.
  const { key } = useLocation();
  return (
    <RequireScope scope="imports:write">
      <PageHeader
        title="Upload results"
        description="Send an instrument result file: Meltwire shows how it reads the file before anything is stored, then imports it and keeps the raw bytes with their SHA-256."
      />
      <UploadWizard
        key={key}
        createdSamples={(importId) => <SamplesTable filters={{ import_id: importId }} unit="%" />}
        flagLabel={(flag) => flagInfo(flag).label}
      />
    </RequireScope>
  );
}
