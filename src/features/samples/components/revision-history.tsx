// A released sample's revisions: who, when, why, and each element's reported value before and after.
import { ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { useRevisions } from '../api/release.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

export function RevisionHistory({ sampleId, released }: { sampleId: string; released: boolean }) {
  const revisions = useRevisions(sampleId, released);
  if (!released) return null;
  if (revisions.isPending) return <Spinner label="Loading revisions…" />;
  if (revisions.error) return <ProblemAlert error={revisions.error} />;
  return (
    <Table head={['Revision', 'When', 'By', 'Why', 'Changed']} caption="Revisions of this sample">
      {revisions.data.data.map((r) => (
        <tr key={r.revision} data-testid="revision-row">
          <td className="px-3 py-1.5 font-mono">{r.revision}</td>
          <td className="px-3 py-1.5 font-mono text-xs">
            <Timestamp value={r.at} seconds />
          </td>
          <td className="px-3 py-1.5">{r.by}</td>
          <td className="px-3 py-1.5">{r.reason ?? 'Released'}</td>
          <td className="px-3 py-1.5 font-mono text-xs">
            {r.changed_elements.map((c) => `${c.element} ${c.before ?? '—'} → ${c.after ?? '—'}`).join('; ') || '—'}
          </td>
        </tr>
      ))}
    </Table>
  );
}
