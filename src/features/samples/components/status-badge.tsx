import { Badge } from '../../../components/ui/layout.tsx';
import type { SampleStatus } from '../filters.ts';

/** Draft or released, in words with a mark (colour only repeats it). */
export function StatusBadge({ status }: { status: SampleStatus }) {
  return (
    <span className="whitespace-nowrap">{status === 'released' ? <Badge tone="good">✓ released</Badge> : <Badge>✎ draft</Badge>}</span>
  );
}
