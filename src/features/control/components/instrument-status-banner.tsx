// The instrument's control status as a banner while it is `verify` for a method: which control
// point broke which rule, what that means for release, and — for holders of control:write — the
// button that records the disposition.
import { useState } from 'react';
import { hasScope, useMe } from '../../../api/me.ts';
import { useInstrumentStatus } from '../../../api/instrument-status.ts';
import { useMethods } from '../../../api/lookups.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Alert } from '../../../components/ui/feedback.tsx';
import { useControlSamples } from '../api/control-samples.ts';
import { DispositionDialog } from './disposition-dialog.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

/** Nothing while the instrument is in control for the method (or every method when none is given). */
export function InstrumentStatusBanner({ instrumentId, methodId }: { instrumentId: string; methodId?: string }) {
  const { data: me } = useMe();
  const status = useInstrumentStatus(instrumentId);
  const methods = useMethods();
  const [disposing, setDisposing] = useState<string | null>(null);
  if (!status.data) return null;
  const instrument = status.data;
  const open = instrument.control.filter((c) => c.status === 'verify' && (!methodId || c.method_id === methodId));
  if (open.length === 0) return null;
  const canDispose = hasScope(me, 'control:write');
  return (
    <div className="mb-6 space-y-3" data-testid="instrument-status-banner">
      {open.map((c) => {
        const method = methods.data?.find((m) => m.id === c.method_id)?.code ?? c.method_id;
        return (
          <Alert key={c.method_id} tone="caution" title={`${instrument.code} is in verify for ${method}: a control point broke a run rule`}>
            <ul className="list-disc pl-5">
              {c.reason?.violations.map((v) => (
                <li key={v.element + v.rule}>
                  {v.element}: {v.title} <span className="text-xs text-slag-500">({v.source})</span>
                </li>
              ))}
            </ul>
            <p className="mt-1">
              Control point measured <Timestamp value={c.reason?.measured_at} />. Check results measured on {instrument.code} since then
              before releasing them; each release asks for an acknowledgement until a disposition is recorded.
            </p>
            {canDispose && (
              <Button className="mt-2" variant="secondary" onClick={() => setDisposing(c.method_id)}>
                Record disposition
              </Button>
            )}
          </Alert>
        );
      })}
      {disposing && (
        <DispositionDialog
          open
          instrumentId={instrumentId}
          instrumentCode={instrument.code}
          methodId={disposing}
          onClose={() => setDisposing(null)}
        />
      )}
    </div>
  );
}

/** A banner for each instrument with a control sample that is in verify, for the overview page. */
export function InstrumentsStatusBanners() {
  const definitions = useControlSamples();
  const instrumentIds = [...new Set(definitions.data?.map((d) => d.instrument_id))];
  return (
    <>
      {instrumentIds.map((id) => (
        <InstrumentStatusBanner key={id} instrumentId={id} />
      ))}
    </>
  );
}
