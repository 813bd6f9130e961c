// The moving range |xᵢ − xᵢ₋₁| of the same points, on the same time axis as the chart above it,
// with the mean moving range as a dashed line.
import type { ControlChart } from '../api/control-samples.ts';
import { formatValue, linearScale, ticks, timeDomain } from '../chart-geometry.ts';
import { CHART_BOX } from './control-chart.tsx';
import { formatInstant } from '../../../lib/timestamp.ts';

export function MovingRangeChart({ chart }: { chart: ControlChart }) {
  const box = { ...CHART_BOX, height: 170 };
  const ranges = chart.moving_ranges;
  if (ranges.length === 0) return null;
  const x = linearScale(timeDomain(chart.points.map((p) => p.measured_at)), [box.left, box.width - box.right]);
  const max = Math.max(...ranges.map((r) => r.value)) * 1.1 || 1;
  const y = linearScale([0, max], [box.height - box.bottom, box.top]);
  const mean = ranges.reduce((sum, r) => sum + r.value, 0) / ranges.length;
  const path = ranges.map((r, i) => `${i ? 'L' : 'M'}${x(Date.parse(r.measured_at))},${y(r.value)}`).join('');
  return (
    <svg
      viewBox={`0 0 ${box.width} ${box.height}`}
      className="w-full"
      role="img"
      data-testid="moving-range-chart"
      aria-label={`Moving range of ${chart.element}: ${ranges.length} values, mean ${formatValue(mean)} %, largest ${formatValue(Math.max(...ranges.map((r) => r.value)))} %.`}
    >
      <text x={box.left} y={14} className="fill-slag-700 text-[11px]">
        Moving range of {chart.element} (%)
      </text>
      {ticks([0, max], 3).map((v) => (
        <text key={v} x={box.left - 6} y={y(v) + 4} textAnchor="end" className="fill-slag-500 font-mono text-[10px]">
          {formatValue(v)}
        </text>
      ))}
      <line x1={box.left} x2={box.width - box.right} y1={y(0)} y2={y(0)} stroke="#d9cfc2" />
      <line x1={box.left} x2={box.width - box.right} y1={y(mean)} y2={y(mean)} stroke="#2f7d6d" strokeDasharray="5 3" />
      <text x={box.width - box.right + 4} y={y(mean) + 4} className="fill-verdigris-600 text-[11px]">
        mean
      </text>
      <path d={path} fill="none" stroke="#6b7c8a" />
      {ranges.map((r) => (
        <circle key={r.sample_id} cx={x(Date.parse(r.measured_at))} cy={y(r.value)} r={2.5} fill="#2f4858">
          <title>{`${formatInstant(r.measured_at)}: ${formatValue(r.value)} %`}</title>
        </circle>
      ))}
    </svg>
  );
}
