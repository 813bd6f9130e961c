import { Link, useSearchParams } from 'react-router';
import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { SampleFilterForm } from '../../features/samples/components/sample-filter-form.tsx';
import { SamplesTable } from '../../features/samples/components/samples-table.tsx';
import { UnitSwitch } from '../../features/samples/components/unit-switch.tsx';
import { csvHref, readFilters, readUnit, writeFilters, type SampleFilters } from '../../features/samples/filters.ts';
import { paths } from '../../config/paths.ts';

export function SamplesPage() {
  const [params, setParams] = useSearchParams();
  const filters = readFilters(params);
  const unit = readUnit(params);
  const show = (next: SampleFilters, nextUnit = unit) => setParams(writeFilters(next, nextUnit));
  const { import_id: importId, ...formFilters } = filters;

  return (
    <RequireScope scope="samples:read">
      <PageHeader
        title="Samples"
        description="Every sample with its burns averaged per element. Filters are part of the address: copy it to share this view."
        actions={
          <a
            href={csvHref(filters, unit)}
            download
            className="inline-flex items-center rounded-md border border-ash-200 bg-white px-3.5 py-2 text-sm font-medium hover:bg-ash-100"
          >
            ⤓ Download CSV
          </a>
        }
      />
      <div className="space-y-4">
        <SampleFilterForm key={writeFilters(formFilters).toString()} filters={filters} onApply={(next) => show(next)} />
        <div className="flex flex-wrap items-center justify-between gap-3">
          {importId ? (
            <p className="text-sm">
              Only samples of import{' '}
              <Link to={paths.import(importId)} className="font-mono text-copper-700 underline">
                {importId}
              </Link>{' '}
              <button
                type="button"
                className="ml-1 rounded px-1.5 text-copper-700 underline hover:bg-ash-100"
                onClick={() => show(formFilters)}
              >
                show all imports
              </button>
            </p>
          ) : (
            <span />
          )}
          <UnitSwitch value={unit} onChange={(next) => show(filters, next)} />
        </div>
        <SamplesTable filters={filters} unit={unit} />
      </div>
    </RequireScope>
  );
}
