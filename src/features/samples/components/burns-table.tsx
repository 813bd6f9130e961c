import { Button } from '../../../components/ui/button.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import type { Burn } from '../api/samples.ts';
import { burnFigure } from '../figures.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

const cell = 'px-3 py-2';

/** Element columns: the results' order, then anything only a burn carries. */
export function burnElements(burns: Burn[], resultOrder: string[]): string[] {
  const seen = new Set(resultOrder);
  const extra = burns.flatMap((b) => Object.keys(b.values)).filter((el) => !seen.has(el) && (seen.add(el), true));
  return [...resultOrder, ...extra];
}

function rawTitle(value: Burn['values'][string]): string {
  return `As received: ${value.raw} ${value.raw_unit}`.trim();
}

export function BurnsTable({
  burns,
  elements,
  unit,
  onToggle,
}: {
  burns: Burn[];
  elements: string[];
  unit: string;
  onToggle?: (burn: Burn) => void;
}) {
  return (
    <Table
      caption={`Burns, one row each, values in ${unit}; hover a value for the value as received`}
      head={[
        'Burn',
        'Measured',
        'Line',
        'State',
        ...elements.map((el) => (
          <span key={el} className="block text-right font-mono normal-case">
            {el}
          </span>
        )),
      ]}
    >
      {burns.map((burn) => (
        <tr
          key={burn.number}
          className={`align-top ${burn.excluded ? 'bg-ash-100 text-slag-500' : ''}`}
          data-testid="burn-row"
          data-burn={burn.number}
          data-excluded={burn.excluded}
        >
          <th scope="row" className={`${cell} text-right font-mono`}>
            {burn.number}
          </th>
          <td className={`${cell} whitespace-nowrap font-mono text-xs`}>
            <Timestamp value={burn.measured_at} seconds />
          </td>
          <td className={`${cell} text-right font-mono text-xs`}>{burn.source_line ?? '—'}</td>
          <td className={`${cell} min-w-40 text-xs`}>
            {burn.excluded ? (
              <span className="block">
                <span className="font-semibold text-oxide-600">✕ Excluded</span>
                {burn.exclusion && (
                  <span className="block text-slag-700">
                    “{burn.exclusion.reason}” — {burn.exclusion.by}, <Timestamp value={burn.exclusion.at} seconds />
                  </span>
                )}
              </span>
            ) : (
              <span className="block">
                ✓ Included
                {burn.exclusion && <span className="block text-slag-500">Included again: “{burn.exclusion.reason}”</span>}
              </span>
            )}
            {/* Beside the state, not after the element columns: a wide method would push it out of view. */}
            {onToggle && (
              <Button
                variant="secondary"
                className="mt-1 !px-2 !py-0.5 text-xs"
                onClick={() => onToggle(burn)}
                aria-label={`${burn.excluded ? 'Include' : 'Exclude'} burn ${burn.number}`}
              >
                {burn.excluded ? 'Include…' : 'Exclude…'}
              </Button>
            )}
          </td>
          {elements.map((el) => {
            const value = burn.values[el];
            return (
              <td
                key={el}
                className={`${cell} whitespace-nowrap text-right font-mono tabular-nums ${burn.excluded ? 'line-through decoration-oxide-600' : ''}`}
                title={value ? rawTitle(value) : 'Not measured in this burn'}
              >
                {value ? burnFigure(value) : ''}
              </td>
            );
          })}
        </tr>
      ))}
    </Table>
  );
}
