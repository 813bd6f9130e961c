import type { ImportPreview } from '../api/imports.ts';

const grouped = new Intl.NumberFormat('en');

/** How the file was read (encoding, delimiter …) and its counts, as a compact strip. */
export function LayoutSummary({ layout, counts }: { layout: ImportPreview['layout']; counts: [label: string, value: number][] }) {
  return (
    <div className="space-y-3">
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6" data-testid="import-counts">
        {counts.map(([label, value]) => (
          <div key={label} className="rounded-md border border-ash-200 bg-white px-3 py-2">
            <dt className="text-xs text-slag-500">{label}</dt>
            <dd className="text-right font-mono text-lg font-semibold tabular-nums" data-count={label}>
              {grouped.format(value)}
            </dd>
          </div>
        ))}
      </dl>
      <p className="text-xs text-slag-500">
        Read as <strong>{layout.layout}</strong> layout · encoding <code>{layout.encoding}</code> · delimiter{' '}
        <code>{layout.delimiter}</code> · decimal separator <code>{layout.decimal_separator}</code>
      </p>
    </div>
  );
}
