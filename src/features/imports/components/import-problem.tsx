import { isProblem } from '../../../api/problem.ts';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { formatBytes, formatBytesExactly } from '../../../lib/format-bytes.ts';
import type { ImportIssue } from '../api/imports.ts';
import { ImportIssuesTable } from './import-issues-table.tsx';

function isIssueList(value: unknown): value is ImportIssue[] {
  return (
    Array.isArray(value) &&
    value.every((item) => typeof item === 'object' && item !== null && typeof (item as ImportIssue).message === 'string')
  );
}

/** An upload or preview that failed: too large (413), unreadable lines (422 with issues), or any other problem. */
export function ImportProblem({ error, fileSize, during }: { error: Error | null; fileSize?: number; during: 'preview' | 'import' }) {
  if (!error) return null;
  if (isProblem(error, 413)) {
    const limit = typeof error.extensions.limit_bytes === 'number' ? error.extensions.limit_bytes : undefined;
    return (
      <Alert title="The file is too large">
        <p data-testid="too-large">
          {limit !== undefined ? (
            <>The server accepts files of at most {formatBytesExactly(limit)}.</>
          ) : (
            <>The file is larger than the server accepts.</>
          )}
          {fileSize !== undefined && <> This file is {formatBytes(fileSize)}.</>} Split it into smaller files, or ask the administrator to
          raise IMPORT_MAX_BYTES.
        </p>
      </Alert>
    );
  }
  const problem = isProblem(error, 422) ? error : null;
  const issues = problem && isIssueList(problem.extensions.issues) ? problem.extensions.issues : null;
  if (!problem || !issues) return <ProblemAlert error={error} />;
  const total = typeof problem.extensions.errors_total === 'number' ? problem.extensions.errors_total : issues.length;
  return (
    <div className="space-y-3" data-testid="import-problem">
      <Alert title={during === 'preview' ? 'The file cannot be read' : 'Nothing was imported'}>
        <p>
          {during === 'preview' ? (
            problem.message
          ) : (
            <>
              No sample of this file was stored: the lines below cannot be read, and the whole file is refused when any line cannot be.
              Correct them and upload the file again, or choose “Sample by sample” to store the other samples.
            </>
          )}
        </p>
        {total > issues.length && (
          <p className="mt-1">
            The first {issues.length} of {total} problems are listed.
          </p>
        )}
      </Alert>
      <ImportIssuesTable issues={issues} caption="Lines that cannot be read" testId="problem-issues" />
    </div>
  );
}
