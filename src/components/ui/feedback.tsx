import type { ReactNode } from 'react';
import type { ApiProblem } from '../../api/problem.ts';

export function Spinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-2 py-6 text-sm text-slag-500">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-ash-200 border-t-ember-500" aria-hidden />
      {label}
    </div>
  );
}

export function Alert({
  tone = 'error',
  title,
  children,
}: {
  tone?: 'error' | 'info' | 'success' | 'caution';
  title: string;
  children?: ReactNode;
}) {
  const styles = {
    error: 'border-oxide-600 bg-oxide-50 text-oxide-600',
    info: 'border-ash-200 bg-white text-slag-800',
    success: 'border-verdigris-600 bg-verdigris-50 text-verdigris-600',
    caution: 'border-ember-500 bg-ash-100 text-slag-900',
  }[tone];
  const icon = { error: '⚠', info: 'ℹ', success: '✓', caution: '!' }[tone];
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md border-l-4 px-4 py-3 text-sm ${styles}`}>
      <p className="font-semibold">
        <span aria-hidden className="mr-1.5">
          {icon}
        </span>
        {title}
      </p>
      {children && <div className="mt-1 text-slag-800">{children}</div>}
    </div>
  );
}

/** A problem response as a readable message, with any errors no form field claimed. */
export function ProblemAlert({ error, fields = [] }: { error: ApiProblem | Error | null | undefined; fields?: string[] }) {
  if (!error) return null;
  const problem = 'problem' in error ? (error as ApiProblem) : undefined;
  const others = problem?.otherErrors(fields) ?? [];
  const onlyFieldErrors = problem?.problem.errors?.length && others.length === 0;
  return (
    <Alert title={problem?.problem.title ?? 'Something went wrong'}>
      {!onlyFieldErrors && <p>{error.message}</p>}
      {onlyFieldErrors && <p>Check the highlighted fields.</p>}
      {others.length > 0 && (
        <ul className="mt-1 list-disc pl-5">
          {others.map((e) => (
            <li key={e.location + e.message}>
              <code className="text-xs">{e.location}</code>: {e.message}
            </li>
          ))}
        </ul>
      )}
      {problem?.problem.type.startsWith('/problems/') && (
        <p className="mt-1 text-xs">
          <a className="underline" href={problem.problem.type} target="_blank" rel="noreferrer">
            What this error means and what to do
          </a>
        </p>
      )}
    </Alert>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-ash-200 bg-white px-6 py-10 text-center">
      <p className="font-medium text-slag-800">{title}</p>
      {children && <div className="mt-1 text-sm text-slag-500">{children}</div>}
    </div>
  );
}
