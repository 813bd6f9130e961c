// Slope and offset of one element over time: a line chart with labelled axes (slope left,
// offset right), point shapes by flag, and the same data as a table for screen readers and
// for anyone who prefers numbers.
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { Link } from 'react-router';
import { Table } from '../../../components/ui/layout.tsx';
import type { DriftPoint } from '../api/standardizations.ts';
import { type ChartRow, formatDay, shortDecimal, toChartRows } from '../chart-data.ts';
import { FlagBadge, StatusText } from './flag-badge.tsx';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { formatInstant } from '../../../lib/timestamp.ts';

const AXIS = new Intl.NumberFormat('en-US', { maximumSignificantDigits: 3, useGrouping: false });

interface DotProps {
  cx?: number;
  cy?: number;
  payload?: ChartRow;
  stroke?: string;
}

/** ok: circle; warn: triangle; fail: cross — the shape carries the flag, not only the colour. */
function FlagDot({ cx, cy, payload, stroke }: DotProps) {
  if (cx === undefined || cy === undefined || !payload) return null;
  if (payload.flag === 'fail')
    return (
      <path d={`M${cx - 5},${cy - 5}L${cx + 5},${cy + 5}M${cx - 5},${cy + 5}L${cx + 5},${cy - 5}`} stroke="#b42318" strokeWidth={2.5} />
    );
  if (payload.flag === 'warn')
    return <path d={`M${cx},${cy - 6}L${cx + 6},${cy + 5}L${cx - 6},${cy + 5}Z`} fill="#f0642a" stroke="#a83c10" />;
  return (
    <circle cx={cx} cy={cy} r={payload.inForce ? 5 : 3.5} fill={payload.inForce ? stroke : '#fff'} stroke={stroke} strokeWidth={1.5} />
  );
}

export function DriftChart({ points, element, instrumentCode }: { points: DriftPoint[]; element: string; instrumentCode: string }) {
  const rows = toChartRows(points);
  const first = points[0];
  const last = points[points.length - 1];
  const summary = `Slope and offset of ${element} on ${instrumentCode}: ${points.length} standardization runs from ${formatInstant(first.measured_at)} to ${formatInstant(last.measured_at)}. The data table below lists every point.`;
  return (
    <figure className="space-y-3">
      <div role="img" aria-label={summary} data-testid="drift-chart" className="h-80 w-full rounded-lg border border-ash-200 bg-white p-3">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={rows} margin={{ top: 30, right: 8, bottom: 24, left: 8 }}>
            <CartesianGrid stroke="#e6dccf" strokeDasharray="3 3" />
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
              domain={['auto', 'auto']}
              tickFormatter={(v: number) => AXIS.format(v)}
              label={{ value: 'Slope α', position: 'top', offset: 14 }}
            />
            <YAxis
              yAxisId="offset"
              orientation="right"
              width={104}
              domain={['auto', 'auto']}
              tickFormatter={(v: number) => AXIS.format(v)}
              label={{ value: 'Offset β (%)', position: 'top', offset: 14 }}
            />
            <Tooltip
              labelFormatter={(t) => formatInstant(Number(t))}
              formatter={(value, name) => [typeof value === 'number' ? shortDecimal(String(value)) : '—', name]}
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
              connectNulls={false}
            />
            <Line
              yAxisId="offset"
              type="linear"
              dataKey="offset"
              name="Offset β (%)"
              stroke="#9a5b2e"
              strokeDasharray="5 3"
              dot={<FlagDot />}
              isAnimationActive={false}
              connectNulls={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-xs text-slag-500">
        Points: ● in force, ○ activated earlier or draft, ▲ warn, ✕ fail. Slope 1 and offset 0 mean no correction.
      </figcaption>
      <details className="rounded-lg border border-ash-200 bg-white" data-testid="drift-table">
        <summary className="cursor-pointer px-4 py-2 text-sm font-medium text-copper-700">Data table ({points.length} runs)</summary>
        <Table head={['Measured', 'Slope', 'Offset (%)', 'Flag', 'State', '']} caption={`Drift of ${element} on ${instrumentCode}`}>
          {points.map((p) => (
            <tr key={p.standardization_id}>
              <td className="px-3 py-1.5 font-mono text-xs">
                <Timestamp value={p.measured_at} />
              </td>
              <td className="px-3 py-1.5 font-mono text-xs" title={p.slope ?? undefined}>
                {shortDecimal(p.slope)}
              </td>
              <td className="px-3 py-1.5 font-mono text-xs" title={p.offset ?? undefined}>
                {shortDecimal(p.offset)}
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
