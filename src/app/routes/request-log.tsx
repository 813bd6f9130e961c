import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { Drawer } from '../../components/ui/drawer.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import type { RequestLogFilters } from '../../features/request-log/api/request-log.ts';
import { RequestLogDetail } from '../../features/request-log/components/request-log-detail.tsx';
import { RequestLogFilterForm } from '../../features/request-log/components/request-log-filters.tsx';
import { RequestLogTable } from '../../features/request-log/components/request-log-table.tsx';

export function RequestLogPage() {
  const [filters, setFilters] = useState<RequestLogFilters>({});
  // The open entry lives in the URL, so a replay's new entry (or any entry) can be linked to.
  const [params, setParams] = useSearchParams();
  const open = params.get('entry');
  const show = (id: string | null) => setParams(id ? { entry: id } : {});

  return (
    <RequireScope scope="request-log:read">
      <PageHeader
        title="Request log"
        description="Every call to /api/v1 with its request and response — secrets redacted, bodies cut at the configured size. Admins see every call; everyone else their own and their keys' calls."
      />
      <div className="space-y-4">
        <RequestLogFilterForm onApply={setFilters} />
        <RequestLogTable filters={filters} onOpen={show} />
      </div>
      <Drawer open={!!open} title={<span className="font-mono text-base">{open}</span>} onClose={() => show(null)}>
        {open && <RequestLogDetail key={open} id={open} />}
      </Drawer>
    </RequireScope>
  );
}
