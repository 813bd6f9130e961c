import { PageHeader } from '../../components/ui/layout.tsx';
import { AuditTable } from '../../features/audit/audit-table.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';

export function AuditPage() {
  return (
    <RequireScope scope="audit:read">
      <PageHeader
        title="Audit trail"
        description="Every change: who (user or API key), what, which record, when — with the record before and after. Entries are never edited or deleted."
      />
      <AuditTable />
    </RequireScope>
  );
}
