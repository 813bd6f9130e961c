import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { LoadMore } from '../../../components/ui/load-more.tsx';
import { type Grade, useGrades } from '../api/grades.ts';
import { limitsText } from '../limits-text.ts';

/** Every grade in its latest version, with its limits as written and where they come from. */
export function GradesTable({ onEdit }: { onEdit?: (grade: Grade) => void }) {
  const grades = useGrades();
  const rows = grades.data?.pages.flatMap((page) => page.data) ?? [];
  if (grades.isPending) return <Spinner label="Loading grades…" />;
  if (grades.error) return <ProblemAlert error={grades.error} />;
  if (rows.length === 0)
    return <EmptyState title="No grades yet">Define one to have every sample naming it judged against its limits.</EmptyState>;
  return (
    <div className="space-y-3">
      <Table head={['Code', 'Title', 'Standard', 'Rule', 'Limits (%)', 'Version', '']} caption="Grades">
        {rows.map((g) => (
          <tr key={g.code} data-testid="grade-row" className="align-top">
            <th scope="row" className="px-3 py-2 font-mono">
              {g.code}
            </th>
            <td className="px-3 py-2">{g.title}</td>
            <td className="px-3 py-2">
              {g.standard}
              {g.edition && <span className="text-slag-500"> ({g.edition})</span>}
              {g.source_note && <p className="text-xs text-slag-500">{g.source_note}</p>}
            </td>
            <td className="px-3 py-2">{g.decision_rule === 'rounding' ? 'Rounding (ASTM E29)' : 'Absolute'}</td>
            <td className="whitespace-pre px-3 py-2 font-mono text-xs">
              {limitsText(g.limits)}
              {g.others_each && `\nothers each ${g.others_each}`}
              {g.others_total && `\nothers total ${g.others_total}`}
              {g.remainder_element && `\n${g.remainder_element} remainder`}
            </td>
            <td className="px-3 py-2 font-mono" data-testid="grade-version">
              {g.version}
            </td>
            <td className="px-3 py-2">
              {onEdit && (
                <button type="button" className="text-sm text-copper-700 underline" onClick={() => onEdit(g)}>
                  New version
                </button>
              )}
            </td>
          </tr>
        ))}
      </Table>
      <LoadMore list={grades} />
    </div>
  );
}
