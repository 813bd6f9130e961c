// The Overview's work queues for the lab: what waits for review, what carries a flag someone should
// look at (shown without the notes), and which heats are out of their grade's specification.
import type { SampleSummary } from '../api/samples.ts';
import { attentionFlags, SampleListCard } from './sample-list-card.tsx';

/** The drafts the Overview reads: the newest first, enough for a shift. */
const DRAFTS_FETCHED = 100;
const SHOWN = 6;

// Control samples are drafts too, but they are judged on their control charts, not released.
const isHeatSample = (sample: SampleSummary) => sample.kind !== 'control';
const needsAttention = (sample: SampleSummary) => isHeatSample(sample) && attentionFlags(sample.flags).length > 0;
const partOfDrafts = (fetched: number) => `Counted among the ${fetched} newest drafts; the Samples page lists them all.`;

export function AwaitingReviewCard() {
  return (
    <SampleListCard
      title="Awaiting review"
      filters={{ status: 'draft' }}
      fetch={DRAFTS_FETCHED}
      show={SHOWN}
      keep={isHeatSample}
      empty="Nothing waits for review: every sample is released."
      allLabel="All drafts"
      partialNote={partOfDrafts}
    />
  );
}

export function FlaggedSamplesCard() {
  return (
    <SampleListCard
      title="Flagged drafts"
      filters={{ status: 'draft' }}
      fetch={DRAFTS_FETCHED}
      show={SHOWN}
      keep={needsAttention}
      empty="No draft carries a flag that needs attention."
      allLabel="All drafts"
      partialNote={partOfDrafts}
    />
  );
}

export function OutOfSpecCard() {
  return (
    <SampleListCard
      title="Out of spec"
      filters={{ conforms: 'false' }}
      fetch={SHOWN}
      show={SHOWN}
      empty="No sample is outside its grade's specification."
      allLabel="All samples out of spec"
    />
  );
}
