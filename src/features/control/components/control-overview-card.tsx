// The Overview's control status per instrument: each control sample with its latest point and
// status, and a plain statement for an instrument nobody watches with a control sample.
import { Link } from 'react-router';
import { useInstruments, useMethods, type Instrument } from '../../../api/lookups.ts';
import { ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Card } from '../../../components/ui/layout.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { type ControlSample, useControlChart, useControlSamples } from '../api/control-samples.ts';
import { ControlStatus } from './control-status.tsx';
import { paths } from '../../../config/paths.ts';

function ControlLine({ definition, methodCode }: { definition: ControlSample; methodCode: string }) {
  // As on the Control charts page: the first element's chart says whether limits are still provisional.
  const chart = useControlChart(definition.id, definition.elements[0]);
  const state = definition.status === 'verify' ? 'verify' : chart.data?.provisional ? 'provisional' : 'in_control';
  return (
    <li className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
      <span className="font-mono">{methodCode}</span>
      <Link className="font-mono text-copper-700 underline" to={paths.controlChart(definition.id)}>
        {definition.code}
      </Link>
      <ControlStatus state={state} />
      <span className="text-xs text-slag-500">
        latest point <Timestamp value={definition.latest_point_at} className="font-mono" />
      </span>
    </li>
  );
}

function InstrumentControl({ instrument, definitions }: { instrument: Instrument; definitions: ControlSample[] }) {
  const methods = useMethods();
  return (
    <li className="py-2" data-testid="control-instrument">
      <p className="font-medium text-slag-900">
        {instrument.code} <span className="font-normal text-slag-500">{instrument.name}</span>
      </p>
      {definitions.length === 0 ? (
        <p className="text-sm text-slag-700">No control sample defined: nothing tells whether this instrument can be trusted.</p>
      ) : (
        <ul className="mt-1 space-y-1">
          {definitions.map((d) => (
            <ControlLine key={d.id} definition={d} methodCode={methods.data?.find((m) => m.id === d.method_id)?.code ?? '…'} />
          ))}
        </ul>
      )}
    </li>
  );
}

export function ControlOverviewCard() {
  const instruments = useInstruments();
  const definitions = useControlSamples();
  const pending = instruments.isPending || definitions.isPending;
  return (
    <Card title="Control status">
      {pending && <Spinner label="Loading control samples…" />}
      <ProblemAlert error={instruments.error ?? definitions.error} />
      {instruments.data?.length === 0 && <p className="text-sm text-slag-500">No instruments set up yet.</p>}
      {instruments.data && definitions.data && instruments.data.length > 0 && (
        <ul className="divide-y divide-ash-100" aria-label="Control status">
          {instruments.data.map((instrument) => (
            <InstrumentControl
              key={instrument.id}
              instrument={instrument}
              definitions={definitions.data.filter((d) => d.instrument_id === instrument.id)}
            />
          ))}
        </ul>
      )}
      <Link to={paths.controlSamples} className="mt-3 inline-block text-sm text-copper-700 underline">
        Control charts →
      </Link>
    </Card>
  );
}
