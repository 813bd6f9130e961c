// A short list of samples on the Overview: code, heat and grade, flags, when it was created, and a
// link to the full, filtered list.
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Card } from '../../../components/ui/layout.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { useSamples, type SampleSummary } from '../api/samples.ts';
import { needsAttention } from '../result-flags.ts';
import { writeFilters, type SampleFilters } from '../filters.ts';
import { FlagList } from './flag-badges.tsx';
import { paths } from '../../../config/paths.ts';

/** The flags someone should look at before the result is used; notes are left to the sample page. */
export const attentionFlags = (flags: string[]) => flags.filter(needsAttention);

interface SampleListCardProps {
  title: string;
  /** The samples asked for; the "all" link opens the Samples page with the same filters. */
  filters: SampleFilters;
  /** How many samples to fetch; `keep` may leave fewer. */
  fetch: number;
  /** How many to show. */
  show: number;
  /** Keeps only some of the fetched samples (e.g. those with a flag that needs attention). */
  keep?: (sample: SampleSummary) => boolean;
  empty: ReactNode;
  /** Words for the link to the full list. */
  allLabel: string;
  /** Shows how many samples are in the list beside the title ("12", or "100+" when there are more). */
  counted?: boolean;
  /** Says what the count covers when the fetch did not reach the end of the list. */
  partialNote?: (fetched: number) => string;
}

export function SampleListCard({ title, filters, fetch, show, keep, empty, allLabel, counted = true, partialNote }: SampleListCardProps) {
  const samples = useSamples(filters, '%', fetch);
  const page = samples.data?.pages[0];
  const kept = (page?.data ?? []).filter(keep ?? (() => true));
  const more = page?.next_cursor ? '+' : '';
  return (
    <Card title={page && counted ? `${title} (${kept.length}${more})` : title}>
      {samples.isPending && <Spinner label="Loading samples…" />}
      <ProblemAlert error={samples.error} />
      {page && kept.length === 0 && <p className="text-sm text-slag-500">{empty}</p>}
      {kept.length > 0 && (
        <ul className="divide-y divide-ash-100 text-sm" aria-label={title}>
          {kept.slice(0, show).map((s) => (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-1.5" data-testid="overview-sample">
              <span>
                <Link to={paths.sample(s.id)} className="font-mono text-copper-700 underline">
                  {s.sample_code}
                </Link>
                <span className="ml-2 text-slag-500">{[s.heat, s.grade].filter(Boolean).join(' · ')}</span>
              </span>
              <span className="flex flex-wrap items-center gap-2">
                <FlagList flags={attentionFlags(s.flags)} />
                <Timestamp value={s.created_at} className="font-mono text-xs" />
              </span>
            </li>
          ))}
        </ul>
      )}
      {page?.next_cursor && partialNote && <p className="mt-2 text-xs text-slag-500">{partialNote(page.data.length)}</p>}
      <Link to={paths.samplesMatching(writeFilters(filters))} className="mt-3 inline-block text-sm text-copper-700 underline">
        {allLabel} →
      </Link>
    </Card>
  );
}
