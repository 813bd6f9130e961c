import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import { Alert, ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { useSample, type Burn } from '../../features/samples/api/samples.ts';
import { ConformancePanel, ReleaseSummary } from '../../features/samples/components/conformance-panel.tsx';
import { AmendDialog, ReleaseDialog } from '../../features/samples/components/release-dialogs.tsx';
import { InstrumentStatusBanner } from '../../features/control/components/instrument-status-banner.tsx';
import { RevisionHistory } from '../../features/samples/components/revision-history.tsx';
import { Button } from '../../components/ui/button.tsx';
import { BurnExclusionDialog } from '../../features/samples/components/burn-exclusion-dialog.tsx';
import { BurnsTable } from '../../features/samples/components/burns-table.tsx';
import { SampleAttention } from '../../features/samples/components/sample-attention.tsx';
import { FlagLegend } from '../../features/samples/components/flag-badges.tsx';
import { ResultsTable } from '../../features/samples/components/results-table.tsx';
import { SampleIdentity } from '../../features/samples/components/sample-identity.tsx';
import { SampleProvenance } from '../../features/samples/components/sample-provenance.tsx';
import { UnitSwitch } from '../../features/samples/components/unit-switch.tsx';
import { readUnit, type OutputUnit } from '../../features/samples/filters.ts';
import { paths } from '../../config/paths.ts';

export function SamplePage() {
  const { id = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const unit = readUnit(params);
  const setUnit = (next: OutputUnit) => setParams(next === '%' ? {} : { unit: next }, { replace: true });
  const sample = useSample(id, unit);
  const { data: me } = useMe();
  const [toggling, setToggling] = useState<Burn | null>(null);
  const [dialog, setDialog] = useState<'release' | 'amend' | null>(null);

  const s = sample.data;
  const canChangeBurns = hasScope(me, 'samples:write') && s?.status === 'draft';

  return (
    <RequireScope scope="samples:read">
      <PageHeader
        title={s ? `Sample ${s.sample_code}` : 'Sample'}
        description={s ? [s.heat && `Heat ${s.heat}`, s.grade, s.kind].filter(Boolean).join(' · ') : undefined}
        actions={
          <Link to={paths.samples} className="text-sm text-copper-700 underline">
            ← All samples
          </Link>
        }
      />
      {sample.isPending && <Spinner label="Loading the sample…" />}
      <ProblemAlert error={sample.error} />
      {s && (
        <div className="space-y-6">
          <SampleAttention sample={s} />
          <InstrumentStatusBanner instrumentId={s.instrument.id} methodId={s.method.id} />
          <Alert tone="caution" title="Review before release">
            These results are computed from the burns as stored. They must be reviewed and authorised under your laboratory&apos;s own
            procedures before they are released or reported.
          </Alert>
          <div className="grid gap-6 lg:grid-cols-2">
            <SampleIdentity sample={s} />
            <SampleProvenance sample={s} />
          </div>

          <section aria-labelledby="conformance-heading" className="space-y-3">
            <h2 id="conformance-heading" className="text-lg font-semibold">
              Grade and release
            </h2>
            <div className="flex flex-wrap items-center gap-3">
              <ReleaseSummary sample={s} />
              {hasScope(me, 'samples:release') && s.status === 'draft' && <Button onClick={() => setDialog('release')}>Release…</Button>}
              {hasScope(me, 'samples:release') && s.status === 'released' && (
                <Button variant="secondary" onClick={() => setDialog('amend')}>
                  Amend…
                </Button>
              )}
            </div>
            <ConformancePanel sample={s} />
            <RevisionHistory sampleId={s.id} released={s.status === 'released'} />
            <ReleaseDialog sample={s} open={dialog === 'release'} onClose={() => setDialog(null)} />
            <AmendDialog sample={s} open={dialog === 'amend'} onClose={() => setDialog(null)} />
          </section>

          <section aria-labelledby="results-heading" className="space-y-3">
            <div className="flex flex-wrap items-center justify-between gap-3">
              <h2 id="results-heading" className="text-lg font-semibold">
                Results
              </h2>
              <UnitSwitch value={unit} onChange={setUnit} />
            </div>
            {s.flags.includes('sum_above_100') && (
              <Alert tone="caution" title="The elements add up to more than 100 %">
                Mass fractions cannot exceed 100 %: check the burns, the units of the file and the method before using this result.
              </Alert>
            )}
            <ResultsTable results={s.results} unit={unit} />
            <p className="text-xs text-slag-500" data-testid="rounding-note">
              Reported: the mean of the included burns after drift correction, rounded half to even (ASTM E29) in one step from its full
              value in {unit}, to the step shown per element —{' '}
              {unit === '%'
                ? "the method's reporting decimals."
                : `whole ${unit}, or the method's step where that is finer (never the % value scaled).`}{' '}
              Mean, SD, min and max show two more decimals (hover for the full value); raw mean is before drift correction. How far a value
              can be relied on is the method&apos;s repeatability, not the step.
            </p>
            <FlagLegend flags={[...s.flags, ...s.results.flatMap((r) => r.flags)]} />
          </section>

          <section aria-labelledby="burns-heading" className="space-y-3">
            <h2 id="burns-heading" className="text-lg font-semibold">
              Burns
            </h2>
            {s.status === 'released' && hasScope(me, 'samples:write') && (
              <Alert tone="info" title="Released: burns cannot be excluded or included">
                A released result is never changed in place; it is amended with a new revision.
              </Alert>
            )}
            <BurnsTable
              burns={s.burns}
              results={s.results}
              unit={unit}
              corrected={s.burns.some((b) => Object.values(b.values).some((v) => v.corrected !== null))}
              onToggle={canChangeBurns ? setToggling : undefined}
            />
          </section>
          <BurnExclusionDialog sampleId={s.id} burn={toggling} unit={unit} onClose={() => setToggling(null)} />
        </div>
      )}
    </RequireScope>
  );
}
