import { Link } from 'react-router';
import { PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { ImportsTable } from '../../features/imports/components/imports-table.tsx';
import { paths } from '../../config/paths.ts';

export function ImportsPage() {
  const { data: me } = useMe();
  return (
    <RequireScope scope="samples:read">
      <PageHeader
        title="Imports"
        description="Every uploaded result file with its report, newest first. The raw file is kept exactly as uploaded."
        actions={
          hasScope(me, 'imports:write') && (
            <Link
              to={paths.upload}
              className="inline-flex items-center rounded-md bg-ember-600 px-3.5 py-2 text-sm font-medium text-white hover:bg-ember-700"
            >
              Upload results
            </Link>
          )
        }
      />
      <ImportsTable />
    </RequireScope>
  );
}
