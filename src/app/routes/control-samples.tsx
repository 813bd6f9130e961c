import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { ControlSamplesTable } from '../../features/control/components/control-samples-table.tsx';

export function ControlSamplesPage() {
  return (
    <RequireScope scope="control:read">
      <PageHeader
        title="Control charts"
        description="Control samples sparked regularly on each instrument, charted per element with their run rules. A point that breaks a rule puts the instrument in verify for its method until someone records a disposition."
      />
      <ControlSamplesTable />
    </RequireScope>
  );
}
