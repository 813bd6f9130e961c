import { useParams, useSearchParams } from 'react-router';
import { useInstruments, useMethods } from '../../api/lookups.ts';
import { ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { Card, PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { useControlSample } from '../../features/control/api/control-samples.ts';
import { ChartPanel } from '../../features/control/components/chart-panel.tsx';
import { InstrumentStatusBanner } from '../../features/control/components/instrument-status-banner.tsx';

export function ControlChartPage() {
  const { id = '' } = useParams();
  // Element and view live in the URL, so that a chart can be linked to.
  const [params, setParams] = useSearchParams();
  const definition = useControlSample(id);
  const instruments = useInstruments();
  const methods = useMethods();
  if (definition.isPending) return <Spinner />;
  if (definition.error) return <ProblemAlert error={definition.error} />;
  const d = definition.data;
  const element = params.get('element') ?? d.elements[0];
  const asTable = params.get('view') === 'table';
  const instrumentCode = instruments.data?.find((i) => i.id === d.instrument_id)?.code ?? d.instrument_id;
  const methodCode = methods.data?.find((m) => m.id === d.method_id)?.code ?? d.method_id;
  const show = (next: { element?: string; table?: boolean }) =>
    setParams({ element: next.element ?? element, ...((next.table ?? asTable) ? { view: 'table' } : {}) });

  return (
    <RequireScope scope="control:read">
      <PageHeader
        title={`Control chart ${d.code}`}
        description={`${d.description || 'Control sample'} — ${instrumentCode}, ${methodCode}.`}
      />
      <InstrumentStatusBanner instrumentId={d.instrument_id} methodId={d.method_id} />
      <div className="mb-4 flex flex-wrap items-center gap-2" role="group" aria-label="Element">
        <span className="text-sm font-medium text-slag-800">Element:</span>
        {d.elements.map((e) => (
          <button
            key={e}
            type="button"
            aria-pressed={e === element}
            onClick={() => show({ element: e })}
            className={`rounded-md border px-3 py-1 font-mono text-sm ${e === element ? 'border-ember-600 bg-ember-600 text-white' : 'border-ash-200 bg-white hover:bg-ash-100'}`}
          >
            {e}
          </button>
        ))}
      </div>
      <Card title={`${element} on ${instrumentCode}`}>
        <ChartPanel
          definition={d}
          element={element}
          instrumentCode={instrumentCode}
          asTable={asTable}
          onToggle={() => show({ table: !asTable })}
        />
      </Card>
    </RequireScope>
  );
}
