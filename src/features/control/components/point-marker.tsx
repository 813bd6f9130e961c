// One point on a control chart: a circle when it breaks no rule (hollow while provisional), a
// diamond when it breaks one, with the rule named in words beside it — the shape and the words
// carry the verdict, not the colour alone. Focusable, so the tooltip opens from the keyboard too.
import type { ChartPoint } from '../api/control-samples.ts';
import { describePoint } from '../chart-geometry.ts';

interface Props {
  point: ChartPoint;
  x: number;
  y: number;
  /** Labels go left of points in the right part of the chart, so they stay inside it. */
  labelLeft: boolean;
  onShow: () => void;
  onHide: () => void;
}

export function PointMarker({ point, x, y, labelLeft, onShow, onHide }: Props) {
  const broken = point.violations.length > 0;
  return (
    <g
      tabIndex={0}
      role="img"
      aria-label={describePoint(point)}
      data-testid={broken ? 'violation-point' : 'chart-point'}
      onMouseEnter={onShow}
      onMouseLeave={onHide}
      onFocus={onShow}
      onBlur={onHide}
      className="cursor-pointer outline-none [&:focus>.focus-ring]:opacity-100"
    >
      <circle className="focus-ring opacity-0" cx={x} cy={y} r={10} fill="none" stroke="#1d4ed8" strokeWidth={2} />
      {/* A larger invisible target, easier to hover than a 4 px dot. */}
      <circle cx={x} cy={y} r={8} fill="transparent" />
      {broken ? (
        <>
          <path d={`M${x},${y - 7}L${x + 7},${y}L${x},${y + 7}L${x - 7},${y}Z`} fill="#b42318" stroke="#1f1a17" strokeWidth={1.2} />
          {point.violations.map((v, i) => (
            <text
              key={v.rule}
              x={labelLeft ? x - 10 : x + 10}
              y={y - 10 - i * 13}
              textAnchor={labelLeft ? 'end' : 'start'}
              className="fill-oxide-600 text-[11px] font-semibold"
            >
              {v.title}
            </text>
          ))}
        </>
      ) : (
        <circle cx={x} cy={y} r={3.5} fill={point.provisional ? '#fff' : '#2f4858'} stroke="#2f4858" strokeWidth={1.5} />
      )}
    </g>
  );
}
