import { Link, useSearchParams } from 'react-router';
import { EmptyState, ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { Card, PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { type Method, useInstruments, useMethods } from '../../api/lookups.ts';
import { useCorrectionsInForce, useDrift } from '../../features/drift/api/standardizations.ts';
import { DriftChart } from '../../features/drift/components/drift-chart.tsx';
import { DriftFilters, type DriftSelection } from '../../features/drift/components/drift-filters.tsx';
import { InForceCard } from '../../features/drift/components/in-force-card.tsx';
import { RunsTable } from '../../features/drift/components/runs-table.tsx';
import { paths } from '../../config/paths.ts';

function DriftHistory({ selection, instrumentCode, method }: { selection: DriftSelection; instrumentCode: string; method: Method }) {
  const drift = useDrift(selection.instrumentId, selection.element, selection.methodId);
  if (drift.isPending) return <Spinner label="Loading the drift history…" />;
  if (drift.error) return <ProblemAlert error={drift.error} />;
  if (drift.data.points.length === 0)
    return <EmptyState title={`No standardization of ${selection.element} yet`}>Run one to start the history.</EmptyState>;
  return <DriftChart points={drift.data.points} element={selection.element} instrumentCode={instrumentCode} method={method} />;
}

export function DriftPage() {
  const { data: me } = useMe();
  const instruments = useInstruments();
  const methods = useMethods();
  // The selection lives in the URL so that a chart can be linked to.
  const [params, setParams] = useSearchParams();
  const instrumentId = params.get('instrument') ?? instruments.data?.[0]?.id ?? '';
  const inForce = useCorrectionsInForce(instrumentId);
  const methodId = params.get('method') ?? inForce.data?.data[0]?.method.id ?? methods.data?.[0]?.id ?? '';
  const method = methods.data?.find((m) => m.id === methodId);
  const selection: DriftSelection = { instrumentId, methodId, element: params.get('element') ?? method?.elements[0]?.element ?? '' };
  const instrument = instruments.data?.find((i) => i.id === instrumentId);

  return (
    <RequireScope scope="standardizations:read">
      <PageHeader
        title="Drift"
        description="Standardization runs per instrument and method: slope and offset of each element over time, their flags, and the correction set in force. Corrections are applied to concentrations (result files carry no intensity ratios)."
        actions={
          hasScope(me, 'standardizations:write') && (
            <Link className="rounded-md bg-ember-600 px-3.5 py-2 text-sm font-medium text-white hover:bg-ember-700" to={paths.driftNewRun}>
              Run a standardization
            </Link>
          )
        }
      />
      {instruments.isPending || methods.isPending || (instrumentId && inForce.isPending) ? (
        <Spinner />
      ) : instruments.error || methods.error ? (
        <ProblemAlert error={instruments.error ?? methods.error} />
      ) : !instrument || !method ? (
        <EmptyState title="No instrument or method yet">Register them first.</EmptyState>
      ) : (
        <div className="space-y-6">
          <div className="flex flex-wrap items-start justify-between gap-6">
            <DriftFilters
              instruments={instruments.data}
              methods={methods.data}
              value={selection}
              onChange={(next) => setParams({ instrument: next.instrumentId, method: next.methodId, element: next.element })}
            />
            <InForceCard instrumentId={instrumentId} methodId={methodId} />
          </div>
          <Card title={`${selection.element} on ${instrument.code} — slope and offset over time`}>
            <DriftHistory selection={selection} instrumentCode={instrument.code} method={method} />
          </Card>
          <section className="space-y-3">
            <h2 className="text-sm font-semibold uppercase tracking-wide text-slag-500">
              Runs of {instrument.code} with {method.code}
            </h2>
            <RunsTable instrumentId={instrumentId} methodId={methodId} />
          </section>
        </div>
      )}
    </RequireScope>
  );
}
