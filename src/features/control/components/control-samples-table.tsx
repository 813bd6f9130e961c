// The control sample definitions with each one's latest status: a violation (instrument in
// verify), provisional (limits still being established) or in control.
import { Link } from 'react-router';
import { useInstruments, useMethods } from '../../../api/lookups.ts';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { type ControlSample, useControlChart, useControlSamples } from '../api/control-samples.ts';
import { ControlStatus } from './control-status.tsx';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

function Row({ definition, instrumentCode, methodCode }: { definition: ControlSample; instrumentCode: string; methodCode: string }) {
  // The first element's chart says whether the limits are still provisional and how many points there are.
  const chart = useControlChart(definition.id, definition.elements[0]);
  const provisional = chart.data?.provisional ?? false;
  return (
    <tr data-testid="control-sample-row">
      <td className="px-3 py-2">
        <Link className="font-mono font-medium text-copper-700 underline" to={paths.controlChart(definition.id)}>
          {definition.code}
        </Link>
        {definition.description && <p className="text-xs text-slag-500">{definition.description}</p>}
      </td>
      <td className="px-3 py-2">{instrumentCode}</td>
      <td className="px-3 py-2">{methodCode}</td>
      <td className="px-3 py-2 font-mono text-xs">{definition.elements.join(', ')}</td>
      <td className="px-3 py-2 font-mono text-xs">{chart.data ? chart.data.points.length : '…'}</td>
      <td className="px-3 py-2 font-mono text-xs">
        <Timestamp value={definition.latest_point_at} />
      </td>
      <td className="px-3 py-2">
        <ControlStatus state={definition.status === 'verify' ? 'verify' : provisional ? 'provisional' : 'in_control'} />
      </td>
    </tr>
  );
}

export function ControlSamplesTable() {
  const list = useControlSamples();
  const instruments = useInstruments();
  const methods = useMethods();
  // The instrument and method codes come with the rows: never a raw id while a lookup is on its way.
  if (list.isPending || instruments.isPending || methods.isPending) return <Spinner label="Loading control samples…" />;
  if (list.error) return <ProblemAlert error={list.error} />;
  if (list.data.length === 0)
    return (
      <EmptyState title="No control samples defined yet">
        Define one per instrument and method through the API (<code>POST /api/v1/control-samples</code>), then push or import its
        measurements as samples of kind <code>control</code>.
      </EmptyState>
    );
  return (
    <Table head={['Control sample', 'Instrument', 'Method', 'Elements', 'Points', 'Latest point', 'Status']} caption="Control samples">
      {list.data.map((d) => (
        <Row
          key={d.id}
          definition={d}
          instrumentCode={instruments.data?.find((i) => i.id === d.instrument_id)?.code ?? d.instrument_id}
          methodCode={methods.data?.find((m) => m.id === d.method_id)?.code ?? d.method_id}
        />
      ))}
    </Table>
  );
}
