import { Link, useSearchParams } from 'react-router';
import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { SampleFilterForm } from '../../features/samples/components/sample-filter-form.tsx';
import { SamplesTable } from '../../features/samples/components/samples-table.tsx';
import { UnitSwitch } from '../../features/samples/components/unit-switch.tsx';
import {
  csvHref,
  hidesControls,
  readFilters,
  readUnit,
  samplesListFilters,
  writeFilters,
  type SampleFilters,
} from '../../features/samples/filters.ts';
import { paths } from '../../config/paths.ts';

export function SamplesPage() {
  const [params, setParams] = useSearchParams();
  const filters = readFilters(params);
  const unit = readUnit(params);
  const show = (next: SampleFilters, nextUnit = unit) => setParams(writeFilters(next, nextUnit));
  const { import_id: importId, controls, ...formFilters } = filters;
  const listed = samplesListFilters(filters);

  return (
    <RequireScope scope="samples:read">
      <PageHeader
        title="Samples"
        description="Every sample with its burns averaged per element. Filters are part of the address: copy it to share this view."
        actions={
          <a
            href={csvHref(listed, unit)}
            download
            className="inline-flex items-center rounded-md border border-ash-200 bg-white px-3.5 py-2 text-sm font-medium hover:bg-ash-100"
          >
            ⤓ Download CSV
          </a>
        }
      />
      <div className="space-y-4">
        <SampleFilterForm
          key={writeFilters(formFilters).toString()}
          filters={filters}
          onApply={(next) => show({ ...next, ...(controls && Object.keys(next).length > 0 ? { controls } : {}) })}
        />
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
          ) : hidesControls(filters) ? (
            <p className="text-sm text-slag-700" data-testid="controls-hidden">
              Control-sample points are left out (they are on{' '}
              <Link to={paths.controlSamples} className="text-copper-700 underline">
                Control charts
              </Link>
              ).{' '}
              <button
                type="button"
                className="rounded px-1.5 text-copper-700 underline hover:bg-ash-100"
                onClick={() => show({ ...filters, controls: 'shown' })}
              >
                Show them too
              </button>
            </p>
          ) : controls ? (
            <p className="text-sm text-slag-700">
              Including control-sample points.{' '}
              <button
                type="button"
                className="rounded px-1.5 text-copper-700 underline hover:bg-ash-100"
                onClick={() => show({ ...filters, controls: undefined })}
              >
                Leave them out
              </button>
            </p>
          ) : (
            <span />
          )}
          <UnitSwitch value={unit} onChange={(next) => show(filters, next)} />
        </div>
        <SamplesTable filters={listed} unit={unit} />
      </div>
    </RequireScope>
  );
}
