// One element's chart with its moving range below, or — toggled — the same points as a table.
import { Button } from '../../../components/ui/button.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Badge } from '../../../components/ui/layout.tsx';
import { type ControlSample, useControlChart } from '../api/control-samples.ts';
import { ChartLimits } from './chart-limits.tsx';
import { ControlChartSvg } from './control-chart.tsx';
import { MovingRangeChart } from './moving-range-chart.tsx';
import { PointsTable } from './points-table.tsx';

interface Props {
  definition: ControlSample;
  element: string;
  instrumentCode: string;
  asTable: boolean;
  onToggle: () => void;
}

export function ChartPanel({ definition, element, instrumentCode, asTable, onToggle }: Props) {
  const chart = useControlChart(definition.id, element);
  if (chart.isPending) return <Spinner label={`Loading the ${element} chart…`} />;
  if (chart.error) return <ProblemAlert error={chart.error} />;
  const data = chart.data;
  if (data.points.length === 0)
    return (
      <EmptyState title={`No control points for ${element} yet`}>
        Push or import measurements of {definition.code} (kind <code>control</code>) to start the chart.
      </EmptyState>
    );
  const broken = data.points.filter((p) => p.violations.length > 0).length;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-slag-700">
          {data.points.length} points, {broken === 0 ? 'none breaking a rule' : `${broken} breaking a rule`}.{' '}
          {data.provisional && (
            <Badge tone="accent">
              <span data-testid="provisional-badge">
                Provisional: limits are established from the first {definition.baseline_n} points; no rule is applied until then
              </span>
            </Badge>
          )}
        </p>
        <Button variant="secondary" aria-pressed={asTable} onClick={onToggle}>
          {asTable ? 'Show the chart' : 'Show the data table'}
        </Button>
      </div>
      {asTable ? (
        <PointsTable chart={data} instrumentCode={instrumentCode} />
      ) : (
        <figure className="space-y-2 rounded-lg border border-ash-200 bg-white p-3">
          <ControlChartSvg chart={data} instrumentCode={instrumentCode} />
          <MovingRangeChart chart={data} />
          <figcaption className="text-xs text-slag-500">
            ● a point within the rules, ○ provisional, ◆ a point that breaks a run rule (named beside it); a dashed outline marks the points
            of a run that breaks one. Bands: ±1σ, ±2σ, ±3σ of the limits in force now; each point is judged with the limits in force when it
            was measured. Hover or focus a point for its sample, time, value and burns.
          </figcaption>
        </figure>
      )}
      <ChartLimits chart={data} />
    </div>
  );
}
