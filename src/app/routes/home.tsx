import { Link } from 'react-router';
import { Alert } from '../../components/ui/feedback.tsx';
import { Card, PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe, type Me } from '../../api/me.ts';
import { ControlOverviewCard } from '../../features/control/components/control-overview-card.tsx';
import { InstrumentsStatusBanners } from '../../features/control/components/instrument-status-banner.tsx';
import { CorrectionsOverviewCard } from '../../features/drift/components/corrections-overview-card.tsx';
import { HealthCard } from '../../features/health/health-card.tsx';
import { InstrumentFeedsCard } from '../../features/instrument-feeds/components/instrument-feeds-card.tsx';
import { AwaitingReviewCard, FlaggedSamplesCard, OutOfSpecCard } from '../../features/samples/components/lab-queue-cards.tsx';
import { RecentSamplesCard } from '../../features/samples/components/recent-samples-card.tsx';
import { paths } from '../../config/paths.ts';

const LINK = 'text-copper-700 underline';

/** Roles that integrate plant systems issue their own keys: they get the developer cards. */
const integrates = (me: Me | null | undefined) => hasScope(me, 'api-keys:write');

function DeveloperCards({ me }: { me: Me | null | undefined }) {
  return (
    <section aria-labelledby="integration-heading" className="mt-8">
      <h2 id="integration-heading" className="mb-3 text-lg font-semibold text-slag-900">
        Integration
      </h2>
      <div className="grid gap-6 lg:grid-cols-2">
        <HealthCard />
        <Card title="You">
          <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 text-sm">
            <dt className="text-slag-500">Role</dt>
            <dd className="font-mono">{me?.user.role}</dd>
            <dt className="text-slag-500">Scopes</dt>
            <dd className="flex flex-wrap gap-1">
              {me?.scopes.map((scope) => (
                <code key={scope} className="rounded bg-ash-100 px-1.5 py-0.5 text-xs">
                  {scope}
                </code>
              ))}
            </dd>
          </dl>
        </Card>
        <Card title="Start integrating" className="lg:col-span-2">
          <ol className="list-decimal space-y-1 pl-5 text-sm">
            <li>
              Issue a key with only the scopes your integration needs on{' '}
              <Link className={LINK} to={paths.apiKeys}>
                API keys
              </Link>
              .
            </li>
            <li>
              Make your first call with the copy-paste examples on{' '}
              <Link className={LINK} to={paths.quickStart}>
                Quick start
              </Link>
              ; every operation is on{' '}
              <Link className={LINK} to={paths.reference}>
                API reference
              </Link>
              .
            </li>
            {hasScope(me, 'request-log:read') && (
              <li>
                Every error is an RFC 9457 problem (<code>application/problem+json</code>) with a request id to quote; the{' '}
                <Link className={LINK} to={paths.requestLog}>
                  Request log
                </Link>{' '}
                shows each call and replays it.
              </li>
            )}
          </ol>
        </Card>
      </div>
    </section>
  );
}

export function HomePage() {
  const { data: me } = useMe();
  const readsSamples = hasScope(me, 'samples:read');
  return (
    <>
      <PageHeader
        title={`Welcome, ${me?.user.name ?? ''}`}
        description="What needs the lab now: samples waiting for review, flags, heats out of spec, drift corrections and control status per instrument."
      />
      {readsSamples && hasScope(me, 'control:read') && <InstrumentsStatusBanners />}
      {readsSamples && (
        <div className="grid gap-6 lg:grid-cols-2">
          <AwaitingReviewCard />
          <FlaggedSamplesCard />
          <OutOfSpecCard />
          <RecentSamplesCard />
          {hasScope(me, 'standardizations:read') && <CorrectionsOverviewCard />}
          {hasScope(me, 'control:read') && <ControlOverviewCard />}
          <div className="lg:col-span-2">
            <InstrumentFeedsCard />
          </div>
        </div>
      )}
      {integrates(me) && <DeveloperCards me={me} />}
      <div className="mt-6">
        <Alert tone="caution" title="Released results decide whether a heat ships">
          Meltwire computes and records; it does not replace review. Results must be reviewed and authorised under your laboratory&apos;s
          own accredited procedures before they are released or put on a certificate.
        </Alert>
      </div>
    </>
  );
}
