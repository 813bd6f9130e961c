import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { Button } from '../../components/ui/button.tsx';
import { Alert, ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { Card, PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { useMethods } from '../../api/lookups.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { useCorrectionsInForce, useRun } from '../../features/drift/api/standardizations.ts';
import { ActivateDialog } from '../../features/drift/components/activate-dialog.tsx';
import { CorrectionsTable } from '../../features/drift/components/corrections-table.tsx';
import { ReferenceBurns } from '../../features/drift/components/reference-burns.tsx';
import { FlagBadge, StatusText } from '../../features/drift/components/flag-badge.tsx';
import { paths } from '../../config/paths.ts';
import { Timestamp } from '../../components/ui/timestamp.tsx';
import { formatInstant } from '../../lib/timestamp.ts';

export function DriftRunPage() {
  const { id = '' } = useParams();
  const { data: me } = useMe();
  const run = useRun(id);
  const methods = useMethods();
  const methodElements = methods.data?.find((m) => m.id === run.data?.method.id)?.elements ?? [];
  // Without the method (deleted elements, still loading) figures get 4 decimals: nothing is hidden.
  const decimalsOf = (element: string) => methodElements.find((e) => e.element === element)?.decimals ?? 4;
  const [activating, setActivating] = useState(false);
  const inForce = useCorrectionsInForce(run.data?.instrument.id ?? '');
  const current = inForce.data?.data.find((d) => d.method.id === run.data?.method.id)?.set;
  // The server refuses to activate a run older than the set in force (it would roll the correction back).
  const superseded = !!current && !!run.data && current.measured_at > run.data.measured_at;
  const canActivate = hasScope(me, 'standardizations:activate') && !superseded;

  return (
    <RequireScope scope="standardizations:read">
      {run.isPending ? (
        <Spinner />
      ) : run.error ? (
        <ProblemAlert error={run.error} />
      ) : (
        <>
          <PageHeader
            title={`Standardization of ${run.data.instrument.code} · ${run.data.method.code}`}
            description={
              <>
                Measured <Timestamp value={run.data.measured_at} />, run by {run.data.created_by}
                {run.data.source_file ? (
                  <>
                    , burns read from{' '}
                    <span className="font-mono" title={`SHA-256 ${run.data.source_file.sha256}`}>
                      {run.data.source_file.name}
                    </span>
                  </>
                ) : (
                  ', burns typed'
                )}
                .{' '}
                <Link className="text-copper-700 underline" to={paths.driftOf(run.data.instrument.id, run.data.method.id)}>
                  Back to the drift history
                </Link>
              </>
            }
            actions={run.data.status === 'draft' && canActivate && <Button onClick={() => setActivating(true)}>Activate…</Button>}
          />
          <div className="space-y-6">
            <div className="flex flex-wrap items-center gap-4 text-sm">
              <span>
                Overall: <FlagBadge flag={run.data.flag} />
              </span>
              <StatusText
                status={run.data.status}
                inForce={run.data.in_force}
                effectiveFrom={run.data.activation?.effective_from ?? null}
              />
              <span className="text-slag-500">Mode: {run.data.mode.replace(/_/g, ' ')}</span>
              {run.data.note && <span className="text-slag-500">Note: {run.data.note}</span>}
            </div>
            {run.data.activation && (
              <Alert
                tone={run.data.activation.override_reason ? 'caution' : 'info'}
                title={`Activated ${formatInstant(run.data.activation.activated_at)} by ${run.data.activation.activated_by}, in force from ${formatInstant(run.data.activation.effective_from)}`}
              >
                {run.data.activation.override_reason && (
                  <p data-testid="override-reason">Override: {run.data.activation.override_reason}</p>
                )}
              </Alert>
            )}
            {run.data.status === 'draft' && superseded && (
              <p className="text-sm text-slag-500">
                A draft that can no longer be activated: a run measured later is in force. Run a new standardization instead.
              </p>
            )}
            {run.data.status === 'draft' && !superseded && !canActivate && (
              <p className="text-sm text-slag-500">A draft: a lab manager or admin reviews and activates it.</p>
            )}
            <CorrectionsTable corrections={run.data.corrections} decimalsOf={decimalsOf} />
            <Card title="Reference measurements (as measured, uncorrected)">
              <div className="space-y-3">
                {run.data.measurements.map((m) => (
                  <ReferenceBurns key={m.reference_material.id} measurement={m} />
                ))}
              </div>
            </Card>
          </div>
          <ActivateDialog run={run.data} open={activating} onClose={() => setActivating(false)} />
        </>
      )}
    </RequireScope>
  );
}
