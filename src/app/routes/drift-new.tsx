import { ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { useImportProfiles, useInstruments, useMethods, useReferenceMaterials } from '../../api/lookups.ts';
import { RunForm } from '../../features/drift/components/run-form.tsx';

export function DriftNewRunPage() {
  const instruments = useInstruments();
  const methods = useMethods();
  const references = useReferenceMaterials();
  // Profiles only help to read an unusual layout: without them the layout is detected.
  const profiles = useImportProfiles();
  const error = instruments.error ?? methods.error ?? references.error;
  return (
    <RequireScope scope="standardizations:write">
      <PageHeader
        title="Run a standardization"
        description="Read the references' burns from the instrument's result file, or type them, as measured (uncorrected). Meltwire computes a correction per element and stores it as a draft; nothing changes until a manager activates it."
      />
      {error ? (
        <ProblemAlert error={error} />
      ) : instruments.data && methods.data && references.data && !profiles.isPending ? (
        <RunForm instruments={instruments.data} methods={methods.data} references={references.data} profiles={profiles.data ?? []} />
      ) : (
        <Spinner />
      )}
    </RequireScope>
  );
}
