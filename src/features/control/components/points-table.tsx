// The chart's data as a table: every point with the limits it was judged with and the rules it breaks.
import { Link } from 'react-router';
import { Table } from '../../../components/ui/layout.tsx';
import type { ControlChart } from '../api/control-samples.ts';
import { formatValue, sigmaOffset } from '../chart-geometry.ts';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

export function PointsTable({ chart, instrumentCode }: { chart: ControlChart; instrumentCode: string }) {
  return (
    <div data-testid="points-table">
      <Table
        head={['#', 'Measured', 'Sample', 'Value (%)', 'Burns', 'Centre ± SD (%)', 'From centre', 'Rules broken']}
        caption={`Control points of ${chart.element} on ${instrumentCode}`}
      >
        {chart.points.map((p, i) => (
          <tr key={p.sample_id} data-testid="point-row" className={p.violations.length ? 'bg-oxide-50' : undefined}>
            <td className="px-3 py-1.5 font-mono text-xs">{i + 1}</td>
            <td className="px-3 py-1.5 font-mono text-xs">
              <Timestamp value={p.measured_at} />
            </td>
            <td className="px-3 py-1.5">
              <Link className="font-mono text-xs text-copper-700 underline" to={paths.sample(p.sample_id)}>
                {p.sample_code}
              </Link>
            </td>
            <td className="px-3 py-1.5 font-mono text-xs">{formatValue(p.value)}</td>
            <td className="px-3 py-1.5 font-mono text-xs">{p.burns_n}</td>
            <td className="px-3 py-1.5 font-mono text-xs">{p.centre === null ? '—' : `${formatValue(p.centre)} ± ${formatValue(p.sd)}`}</td>
            <td className="px-3 py-1.5 font-mono text-xs">{p.provisional ? 'provisional' : sigmaOffset(p)}</td>
            <td className="px-3 py-1.5 text-xs">
              {p.violations.length ? (
                <span className="font-semibold text-oxide-600">
                  <span aria-hidden>◆ </span>
                  {p.violations.map((v) => v.title).join('; ')}
                </span>
              ) : (
                '—'
              )}
            </td>
          </tr>
        ))}
      </Table>
    </div>
  );
}
