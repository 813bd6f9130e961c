import { SampleListCard } from './sample-list-card.tsx';

const RECENT = 5;

export function RecentSamplesCard() {
  return (
    <SampleListCard
      title="Recent samples"
      filters={{}}
      counted={false}
      fetch={RECENT}
      show={RECENT}
      empty="No samples yet."
      allLabel="All samples"
    />
  );
}
