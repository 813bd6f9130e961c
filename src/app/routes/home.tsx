import { Link } from 'react-router';
import { Alert } from '../../components/ui/feedback.tsx';
import { Card, PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { InstrumentsStatusBanners } from '../../features/control/components/instrument-status-banner.tsx';
import { HealthCard } from '../../features/health/health-card.tsx';
import { InstrumentFeedsCard } from '../../features/instrument-feeds/components/instrument-feeds-card.tsx';
import { RecentSamplesCard } from '../../features/samples/components/recent-samples-card.tsx';
import { paths } from '../../config/paths.ts';

export function HomePage() {
  const { data: me } = useMe();
  return (
    <>
      <PageHeader
        title={`Welcome, ${me?.user.name ?? ''}`}
        description="Meltwire is the results hub between the spark stand and everything else: ERP/MES, melt shop screens, quality and certificates."
      />
      {hasScope(me, 'samples:read') && hasScope(me, 'control:read') && <InstrumentsStatusBanners />}
      <div className="grid gap-6 lg:grid-cols-2">
        {hasScope(me, 'samples:read') && <RecentSamplesCard />}
        {hasScope(me, 'samples:read') && <InstrumentFeedsCard />}
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
              <Link className="text-copper-700 underline" to={paths.apiKeys}>
                API keys
              </Link>
              .
            </li>
            <li>
              Make your first call with the copy-paste examples on{' '}
              <Link className="text-copper-700 underline" to={paths.quickStart}>
                Quick start
              </Link>
              ; every operation is on{' '}
              <Link className="text-copper-700 underline" to={paths.reference}>
                API reference
              </Link>
              .
            </li>
            <li>
              Every error is an RFC 9457 problem (<code>application/problem+json</code>) with a request id to quote; the{' '}
              <Link className="text-copper-700 underline" to={paths.requestLog}>
                Request log
              </Link>{' '}
              shows each call and replays it.
            </li>
          </ol>
        </Card>
      </div>
      <div className="mt-6">
        <Alert tone="caution" title="Released results decide whether a heat ships">
          Meltwire computes and records; it does not replace review. Results must be reviewed and authorised under your laboratory&apos;s
          own accredited procedures before they are released or put on a certificate.
        </Alert>
      </div>
    </>
  );
}
