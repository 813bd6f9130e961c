// Slope and offset of one element over time: activated runs as lines (slope left, offset right in
// the element's natural unit), drafts never activated as loose points off the lines, the method's
// warn and fail bands behind the slope, round ticks, point shapes by flag, and the same data as a
// table for screen readers and for anyone who prefers numbers.
import {
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { Link } from 'react-router';
import { Table } from '../../../components/ui/layout.tsx';
import type { Method } from '../../../api/lookups.ts';
import type { DriftPoint } from '../api/standardizations.ts';
import { type ChartRow, formatDay, roundTicks, slopeBands, toChartRows } from '../chart-data.ts';
import { offsetFigure, offsetUnit, slopeFigure } from '../figures.ts';
import { FlagBadge, StatusText } from './flag-badge.tsx';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { formatInstant } from '../../../lib/timestamp.ts';

const BAND_FILL = { warn: '#f0642a', fail: '#b42318' };

interface DotProps {
  cx?: number;
  cy?: number;
  payload?: ChartRow;
  stroke?: string;
}

/** ok: circle (filled when in force, hollow grey for a draft); warn: triangle; fail: cross — the shape carries the flag. */
function FlagDot({ cx, cy, payload, stroke }: DotProps) {
  if (cx === undefined || cy === undefined || !payload || Number.isNaN(cy)) return null;
  if (payload.flag === 'fail')
    return (
      <path d={`M${cx - 5},${cy - 5}L${cx + 5},${cy + 5}M${cx - 5},${cy + 5}L${cx + 5},${cy - 5}`} stroke="#b42318" strokeWidth={2.5} />
    );
  if (payload.flag === 'warn')
    return <path d={`M${cx},${cy - 6}L${cx + 6},${cy + 5}L${cx - 6},${cy + 5}Z`} fill="#f0642a" stroke="#a83c10" />;
  if (payload.status === 'draft')
    return <circle cx={cx} cy={cy} r={3.5} fill="#fff" stroke="#8a8178" strokeDasharray="2 1.5" strokeWidth={1.5} />;
  return (
    <circle cx={cx} cy={cy} r={payload.inForce ? 5 : 3.5} fill={payload.inForce ? stroke : '#fff'} stroke={stroke} strokeWidth={1.5} />
  );
}

const axisFormat = (decimals: number) =>
  new Intl.NumberFormat('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals, useGrouping: false });

export function DriftChart({
  points,
  element,
  instrumentCode,
  method,
}: {
  points: DriftPoint[];
  element: string;
  instrumentCode: string;
  method: Method;
}) {
  const decimals = method.elements.find((e) => e.element === element)?.decimals ?? 4;
  const unit = offsetUnit(decimals);
  const rows = toChartRows(points, unit);
  const slopeAxis = roundTicks(
    rows.flatMap((r) => [r.slope, r.draftSlope]),
    [1],
  );
  const offsetAxis = roundTicks(
    rows.flatMap((r) => [r.offset, r.draftOffset]),
    [0],
  );
  const bands = slopeBands(method.drift_limits, slopeAxis.domain);
  const slopeTick = axisFormat(slopeAxis.decimals);
  const offsetTick = axisFormat(offsetAxis.decimals);
  const draftRows = rows.filter((r) => r.status === 'draft');
  const drafts = draftRows.length;
  const first = points[0];
  const last = points[points.length - 1];
  const summary = `Slope and offset of ${element} on ${instrumentCode}: ${points.length} standardization runs from ${formatInstant(first.measured_at)} to ${formatInstant(last.measured_at)}, ${drafts} of them drafts never activated (shown off the line). The data table below lists every point.`;
  return (
    <figure className="space-y-3">
      <div role="img" aria-label={summary} data-testid="drift-chart" className="h-80 w-full rounded-lg border border-ash-200 bg-white p-3">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={rows} margin={{ top: 30, right: 24, bottom: 24, left: 8 }}>
            <CartesianGrid stroke="#e6dccf" strokeDasharray="3 3" />
            {bands.map((band) => (
              <ReferenceArea
                key={`${band.flag}-${band.y1}`}
                yAxisId="slope"
                y1={band.y1}
                y2={band.y2}
                fill={BAND_FILL[band.flag]}
                fillOpacity={band.flag === 'fail' ? 0.12 : 0.08}
                stroke="none"
                ifOverflow="hidden"
                className={`drift-band-${band.flag}`}
              />
            ))}
            <ReferenceLine yAxisId="slope" y={1} stroke="#8a8178" strokeDasharray="2 2" />
            <XAxis
              dataKey="time"
              type="number"
              scale="time"
              domain={['dataMin', 'dataMax']}
              tickFormatter={formatDay}
              label={{ value: 'Measured (UTC date)', position: 'insideBottom', offset: -14 }}
            />
            <YAxis
              yAxisId="slope"
              width={64}
              domain={slopeAxis.domain}
              ticks={slopeAxis.ticks}
              tickFormatter={(v: number) => slopeTick.format(v)}
              label={{ value: 'Slope α', position: 'top', offset: 14 }}
            />
            <YAxis
              yAxisId="offset"
              orientation="right"
              width={80}
              domain={offsetAxis.domain}
              ticks={offsetAxis.ticks}
              tickFormatter={(v: number) => offsetTick.format(v)}
              label={{ value: `Offset β (${unit})`, position: 'top', offset: 14 }}
            />
            <Tooltip
              labelFormatter={(t) => formatInstant(Number(t))}
              formatter={(value, name) => [
                typeof value === 'number' ? new Intl.NumberFormat('en-US', { maximumSignificantDigits: 5 }).format(value) : '—',
                name,
              ]}
            />
            <Legend verticalAlign="bottom" height={20} wrapperStyle={{ bottom: -4 }} />
            <Line
              yAxisId="slope"
              type="linear"
              dataKey="slope"
              name="Slope α"
              stroke="#2f7d6d"
              strokeWidth={2}
              dot={<FlagDot />}
              isAnimationActive={false}
              connectNulls
            />
            <Line
              yAxisId="offset"
              type="linear"
              dataKey="offset"
              name={`Offset β (${unit})`}
              stroke="#9a5b2e"
              strokeDasharray="5 3"
              dot={<FlagDot />}
              isAnimationActive={false}
              connectNulls
            />
            <Scatter
              yAxisId="slope"
              data={draftRows.filter((r) => r.draftSlope !== null)}
              dataKey="draftSlope"
              name="Draft, slope"
              fill="#8a8178"
              shape={<FlagDot />}
              isAnimationActive={false}
              legendType="none"
            />
            <Scatter
              yAxisId="offset"
              data={draftRows.filter((r) => r.draftOffset !== null)}
              dataKey="draftOffset"
              name="Draft, offset"
              fill="#8a8178"
              shape={<FlagDot />}
              isAnimationActive={false}
              legendType="none"
            />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-slag-500">
        Lines join the activated runs: ● in force, ○ activated earlier. Drafts never activated stand off the line (◌ dashed, ▲ warn, ✕
        fail): they corrected nothing. Shaded: slopes beyond the warn limit ({method.drift_limits.warn}) and, darker, the fail limit (
        {method.drift_limits.fail}) of {method.code} from 1. Slope 1 and offset 0 mean no correction.
      </figcaption>
      <details className="rounded-lg border border-ash-200 bg-white" data-testid="drift-table">
        <summary className="cursor-pointer px-4 py-2 text-sm font-medium text-copper-700">Data table ({points.length} runs)</summary>
        <Table head={['Measured', 'Slope', `Offset (${unit})`, 'Flag', 'State', '']} caption={`Drift of ${element} on ${instrumentCode}`}>
          {points.map((p) => (
            <tr key={p.standardization_id}>
              <td className="px-3 py-1.5 font-mono text-xs">
                <Timestamp value={p.measured_at} />
              </td>
              <td className="px-3 py-1.5 text-right font-mono text-xs" title={p.slope ?? undefined}>
                {slopeFigure(p.slope)}
              </td>
              <td className="px-3 py-1.5 text-right font-mono text-xs" title={p.offset === null ? undefined : `${p.offset} %`}>
                {offsetFigure(p.offset, decimals)}
              </td>
              <td className="px-3 py-1.5">
                <FlagBadge flag={p.flag} />
              </td>
              <td className="px-3 py-1.5">
                <StatusText status={p.status} inForce={p.in_force} effectiveFrom={p.effective_from} />
              </td>
              <td className="px-3 py-1.5 text-right">
                <Link
                  className="text-sm text-copper-700 underline"
                  to={paths.driftRun(p.standardization_id)}
                  aria-label={`Open the run of ${formatInstant(p.measured_at)}`}
                >
                  Open
                </Link>
              </td>
            </tr>
          ))}
        </Table>
      </details>
    </figure>
  );
}
