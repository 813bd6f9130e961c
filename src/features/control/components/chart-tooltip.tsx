// The box that names a hovered or focused point: sample code, time, value, burns and the rules it breaks.
import type { ChartPoint } from '../api/control-samples.ts';
import { formatValue, sigmaOffset } from '../chart-geometry.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

export function ChartTooltip({ point, left, top }: { point: ChartPoint; left: number; top: number }) {
  return (
    <div
      role="tooltip"
      data-testid="chart-tooltip"
      className="pointer-events-none absolute z-10 w-64 -translate-x-1/2 rounded-md border border-ash-200 bg-white px-3 py-2 text-xs shadow-lg"
      style={{ left: `${left}%`, top: `calc(${top}% + 14px)` }}
    >
      <p className="font-mono font-semibold text-slag-900">{point.sample_code}</p>
      <p className="text-slag-500">
        <Timestamp value={point.measured_at} />
      </p>
      <p className="mt-1">
        <span className="font-mono">{formatValue(point.value)} %</span> · {point.burns_n} burns ·{' '}
        {point.provisional ? 'provisional' : sigmaOffset(point)}
      </p>
      {point.violations.length > 0 ? (
        <ul className="mt-1 list-disc pl-4 text-oxide-600">
          {point.violations.map((v) => (
            <li key={v.rule}>{v.title}</li>
          ))}
        </ul>
      ) : (
        <p className="mt-1 text-verdigris-600">No rule broken</p>
      )}
    </div>
  );
}
