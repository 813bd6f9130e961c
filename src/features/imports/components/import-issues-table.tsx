import { ClippedText, ClippedWords } from '../../../components/ui/clipped-text.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import type { ImportIssue } from '../api/imports.ts';

/** Warnings or rejected lines: where (line, column) and why. */
export function ImportIssuesTable({ issues, caption, testId }: { issues: ImportIssue[]; caption: string; testId?: string }) {
  return (
    <div data-testid={testId}>
      <Table
        caption={caption}
        head={[
          <span key="l" className="block text-right">
            Line
          </span>,
          'Column',
          'Reason',
          'Code',
        ]}
      >
        {issues.map((issue, index) => (
          <tr key={`${issue.line}-${issue.column}-${index}`} className="align-top" data-testid="issue-row">
            <td className="px-3 py-1.5 text-right font-mono tabular-nums">{issue.line ?? '—'}</td>
            <td className="px-3 py-1.5 font-mono text-xs">{issue.column ? <ClippedText text={issue.column} /> : '—'}</td>
            <td className="px-3 py-1.5">
              <ClippedWords text={issue.message} />
            </td>
            <td className="px-3 py-1.5 font-mono text-xs text-slag-500">{issue.code}</td>
          </tr>
        ))}
      </Table>
    </div>
  );
}

/** A heading, the count, and the table, or nothing when there are no issues. */
export function IssuesSection({ title, issues, testId }: { title: string; issues: ImportIssue[]; testId: string }) {
  if (issues.length === 0) return null;
  return (
    <section className="space-y-2">
      <h3 className="text-sm font-semibold text-slag-800">
        {title} <span className="font-mono font-normal text-slag-500">({issues.length})</span>
      </h3>
      <ImportIssuesTable issues={issues} caption={title} testId={testId} />
    </section>
  );
}
