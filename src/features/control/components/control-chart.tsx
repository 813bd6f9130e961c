// The control chart of one element, drawn as SVG: centre line, ±1σ/±2σ/±3σ bands of the limits in
// force now, every point in time order, and points that break a rule as labelled diamonds.
import { useState } from 'react';
import type { ControlChart } from '../api/control-samples.ts';
import { type Box, formatDay, formatValue, linearScale, runSpans, ticks, timeDomain, valueDomain } from '../chart-geometry.ts';
import { ChartTooltip } from './chart-tooltip.tsx';
import { PointMarker } from './point-marker.tsx';
import { formatInstant } from '../../../lib/timestamp.ts';

export const CHART_BOX: Box = { width: 900, height: 340, left: 64, right: 56, top: 28, bottom: 36 };

const BANDS = [
  { k: 3, fill: '#fbe4dc', label: '3σ' },
  { k: 2, fill: '#fdf1d8', label: '2σ' },
  { k: 1, fill: '#e6f2ee', label: '1σ' },
] as const;

export function ControlChartSvg({ chart, instrumentCode }: { chart: ControlChart; instrumentCode: string }) {
  const [active, setActive] = useState<number | null>(null);
  const box = CHART_BOX;
  const x = linearScale(timeDomain(chart.points.map((p) => p.measured_at)), [box.left, box.width - box.right]);
  const yDomain = valueDomain(chart);
  const y = linearScale(yDomain, [box.height - box.bottom, box.top]);
  const plotWidth = box.width - box.left - box.right;
  const line = chart.points.map((p, i) => `${i ? 'L' : 'M'}${x(Date.parse(p.measured_at))},${y(p.value)}`).join('');
  const broken = chart.points.filter((p) => p.violations.length).length;
  const first = chart.points[0];
  const last = chart.points.at(-1)!;
  const summary = `Control chart of ${chart.element} on ${instrumentCode}: ${chart.points.length} points from ${formatInstant(first.measured_at)} to ${formatInstant(last.measured_at)}, ${broken} breaking a run rule. Centre line ${formatValue(chart.centre)} %.`;
  const activePoint = active === null ? null : chart.points[active];
  const [t0, t1] = timeDomain(chart.points.map((p) => p.measured_at));

  return (
    <div className="relative">
      <svg viewBox={`0 0 ${box.width} ${box.height}`} className="w-full" role="group" aria-label={summary} data-testid="control-chart">
        {chart.sigma &&
          chart.centre !== null &&
          BANDS.map((band) => {
            const sd = (chart.sigma!.upper_1 - chart.centre!) * band.k;
            return (
              <g key={band.k}>
                <rect
                  x={box.left}
                  width={plotWidth}
                  y={y(chart.centre! + sd)}
                  height={y(chart.centre! - sd) - y(chart.centre! + sd)}
                  fill={band.fill}
                />
                <text x={box.width - box.right + 4} y={y(chart.centre! + sd) + 4} className="fill-slag-500 text-[11px]">
                  +{band.label}
                </text>
                <text x={box.width - box.right + 4} y={y(chart.centre! - sd) + 4} className="fill-slag-500 text-[11px]">
                  −{band.label}
                </text>
              </g>
            );
          })}
        {chart.centre !== null && (
          <g>
            <line x1={box.left} x2={box.width - box.right} y1={y(chart.centre)} y2={y(chart.centre)} stroke="#2f7d6d" strokeWidth={1.5} />
            <text x={box.width - box.right + 4} y={y(chart.centre) + 4} className="fill-verdigris-600 text-[11px] font-semibold">
              CL
            </text>
          </g>
        )}
        {ticks(yDomain, 5).map((v) => (
          <text key={v} x={box.left - 6} y={y(v) + 4} textAnchor="end" className="fill-slag-500 font-mono text-[10px]">
            {formatValue(v)}
          </text>
        ))}
        {ticks([t0, t1], 7).map((t) => (
          <text key={t} x={x(t)} y={box.height - box.bottom + 16} textAnchor="middle" className="fill-slag-500 font-mono text-[10px]">
            {formatDay(t)}
          </text>
        ))}
        <text x={box.left} y={14} className="fill-slag-700 text-[11px]">
          {chart.element} (%)
        </text>
        <text x={box.left + plotWidth / 2} y={box.height - 4} textAnchor="middle" className="fill-slag-700 text-[11px]">
          Measured (UTC date)
        </text>
        {runSpans(chart.points).map(([from, to]) => {
          // The points of a run that breaks a rule, outlined (the rule is named at its last point).
          const run = chart.points.slice(from, to + 1);
          const values = run.map((p) => y(p.value));
          const x0 = x(Date.parse(run[0].measured_at)) - 9;
          const x1 = x(Date.parse(run.at(-1)!.measured_at)) + 9;
          const y0 = Math.min(...values) - 9;
          const y1 = Math.max(...values) + 9;
          return (
            <rect
              key={`${from}-${to}`}
              data-testid="run-outline"
              aria-hidden
              x={x0}
              y={y0}
              width={x1 - x0}
              height={y1 - y0}
              rx={8}
              fill="none"
              stroke="#b42318"
              strokeDasharray="4 3"
            />
          );
        })}
        <path d={line} fill="none" stroke="#6b7c8a" strokeWidth={1} />
        {chart.points.map((p, i) => {
          const px = x(Date.parse(p.measured_at));
          return (
            <PointMarker
              key={p.sample_id}
              point={p}
              x={px}
              y={y(p.value)}
              labelLeft={px > box.left + plotWidth * 0.6}
              onShow={() => setActive(i)}
              onHide={() => setActive((current) => (current === i ? null : current))}
            />
          );
        })}
      </svg>
      {activePoint && (
        <ChartTooltip
          point={activePoint}
          left={(x(Date.parse(activePoint.measured_at)) / box.width) * 100}
          top={(y(activePoint.value) / box.height) * 100}
        />
      )}
    </div>
  );
}
