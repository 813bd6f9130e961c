import type { ReactNode } from 'react';

export function PageHeader({ title, description, actions }: { title: string; description?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-ash-200 pb-4">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight text-slag-900">{title}</h1>
        {description && <p className="mt-1 max-w-3xl text-sm text-slag-500">{description}</p>}
      </div>
      {actions && <div className="flex gap-2">{actions}</div>}
    </header>
  );
}

export function Card({ title, children, className = '' }: { title?: string; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-lg border border-ash-200 bg-white p-5 shadow-xs ${className}`}>
      {title && <h2 className="mb-3 text-sm font-semibold uppercase tracking-wide text-slag-500">{title}</h2>}
      {children}
    </section>
  );
}

export function Badge({ children, tone = 'neutral' }: { children: ReactNode; tone?: 'neutral' | 'good' | 'bad' | 'accent' }) {
  const styles = {
    neutral: 'bg-ash-100 text-slag-700',
    good: 'bg-verdigris-50 text-verdigris-600',
    bad: 'bg-oxide-50 text-oxide-600',
    accent: 'bg-ember-500/10 text-ember-700',
  }[tone];
  return <span className={`inline-flex items-center rounded px-1.5 py-0.5 text-xs font-medium ${styles}`}>{children}</span>;
}

export function Table({ head, children, caption }: { head: ReactNode[]; children: ReactNode; caption?: string }) {
  return (
    <div className="relative overflow-x-auto rounded-lg border border-ash-200 bg-white">
      <table className="min-w-full text-left text-sm">
        {caption && <caption className="sr-only">{caption}</caption>}
        <thead className="bg-ash-100 text-xs uppercase tracking-wide text-slag-500">
          <tr>
            {head.map((h, i) => (
              <th key={i} scope="col" className="px-3 py-2 font-semibold">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-ash-100">{children}</tbody>
      </table>
    </div>
  );
}
