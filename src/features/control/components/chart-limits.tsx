// Under the chart: the limits' validity periods and the run rules, each named with its source.
import type { ControlChart } from '../api/control-samples.ts';
import { formatValue } from '../chart-geometry.ts';
import { formatInstant } from '../../../lib/timestamp.ts';

export function ChartLimits({ chart }: { chart: ControlChart }) {
  return (
    <div className="grid gap-6 text-sm md:grid-cols-2">
      <section>
        <h3 className="mb-2 font-semibold text-slag-800">Limits</h3>
        <ul className="space-y-1" data-testid="limit-periods">
          {chart.limits.map((l, i) => (
            <li key={i}>
              <span className="font-mono">
                {formatValue(l.centre)} ± {formatValue(l.sd)} %
              </span>{' '}
              — {l.source}
              {l.provisional && ' (provisional)'}
              <span className="block text-xs text-slag-500">
                {l.valid_from ? `from ${formatInstant(l.valid_from)}` : 'from the first point'}
                {l.valid_to ? ` to ${formatInstant(l.valid_to)}` : ', in force'}
              </span>
            </li>
          ))}
        </ul>
      </section>
      <section>
        <h3 className="mb-2 font-semibold text-slag-800">Run rules</h3>
        <ul className="space-y-1" data-testid="run-rules">
          {chart.rules.map((r) => (
            <li key={r.rule} className={r.enabled ? '' : 'text-slag-500'}>
              <span aria-hidden>{r.enabled ? '✓ ' : '– '}</span>
              {r.title} {r.enabled ? '' : '(switched off)'}
              <span className="block text-xs text-slag-500">{r.source}</span>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
