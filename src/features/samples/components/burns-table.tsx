// The burns of a sample, one row each: values in the page's unit, as measured or after drift
// correction (a toggle), every element at one precision (its reporting decimals plus the guard
// digits of the mean), and a last row with the mean of the included burns in the same view — so
// the burns visibly average to the result. The element column stays in view while a wide method
// scrolls sideways, and the table says when it scrolls.
import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import type { Burn, ElementResult } from '../api/samples.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { burnFigure, plain, statistic } from '../figures.ts';
import { ScrollingTable } from './scrolling-table.tsx';

export type BurnView = 'measured' | 'corrected';

const cell = 'px-3 py-2';
const sticky = 'sticky left-0 z-10 bg-inherit shadow-[1px_0_0_var(--color-ash-200)]';

/** Element columns: the results' order, then anything only a burn carries. */
export function burnElements(burns: Burn[], resultOrder: string[]): string[] {
  const seen = new Set(resultOrder);
  const extra = burns.flatMap((b) => Object.keys(b.values)).filter((el) => !seen.has(el) && (seen.add(el), true));
  return [...resultOrder, ...extra];
}

function valueTitle(value: Burn['values'][string], shown: { value: number | null }): string {
  const full = shown.value === null ? '' : `Full value: ${plain(shown.value)}. `;
  return `${full}As received: ${value.raw} ${value.raw_unit}`.trim();
}

function BurnState({ burn, onToggle }: { burn: Burn; onToggle?: (burn: Burn) => void }) {
  return (
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
  );
}

export function BurnsTable({
  burns,
  results,
  unit,
  corrected,
  onToggle,
}: {
  burns: Burn[];
  results: ElementResult[];
  unit: string;
  /** Whether a drift correction applied to the burns (the toggle is offered only then). */
  corrected: boolean;
  onToggle?: (burn: Burn) => void;
}) {
  const [view, setView] = useState<BurnView>(corrected ? 'corrected' : 'measured');
  const shownView: BurnView = corrected ? view : 'measured';
  const elements = burnElements(
    burns,
    results.map((r) => r.element),
  );
  const resultOf = new Map(results.map((r) => [r.element, r]));
  const viewName = shownView === 'corrected' ? 'drift-corrected' : 'as measured';
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-slag-700" data-testid="burns-view">
          Values in <strong>{unit}</strong>, <strong>{viewName}</strong>
          {corrected ? '' : ' (no drift correction was in force for these burns)'}; each element at the precision of its mean.
        </p>
        {corrected && (
          <fieldset className="flex items-center gap-2">
            <legend className="float-left mr-2 text-sm font-medium text-slag-800">Show burns</legend>
            <div className="inline-flex overflow-hidden rounded-md border border-ash-200 bg-white">
              {(['measured', 'corrected'] as const).map((option) => (
                <label
                  key={option}
                  className="cursor-pointer border-r border-ash-200 last:border-r-0 has-[:checked]:bg-slag-900 has-[:checked]:text-white has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-ember-500"
                >
                  <input
                    type="radio"
                    name="burn-view"
                    value={option}
                    checked={shownView === option}
                    onChange={() => setView(option)}
                    className="sr-only"
                  />
                  <span className="block px-3 py-1.5 text-sm">{option === 'measured' ? 'As measured' : 'Drift-corrected'}</span>
                </label>
              ))}
            </div>
          </fieldset>
        )}
      </div>
      <ScrollingTable
        label="Burns"
        caption={`Burns, one row each, values in ${unit}, ${viewName}; hover a value for its full value and the value as received`}
        head={[
          <span key="burn" className="block text-right">
            Burn
          </span>,
          'Measured (UTC)',
          <span key="line" className="block text-right">
            Line
          </span>,
          'State',
          ...elements.map((el) => (
            <span key={el} className="block text-right font-mono normal-case">
              {el} <span className="font-sans text-slag-400">{unit}</span>
            </span>
          )),
        ]}
      >
        {burns.map((burn) => (
          <tr
            key={burn.number}
            className={`align-top ${burn.excluded ? 'bg-ash-100 text-slag-500' : 'bg-white'}`}
            data-testid="burn-row"
            data-burn={burn.number}
            data-excluded={burn.excluded}
          >
            <th scope="row" className={`${cell} ${sticky} text-right font-mono`}>
              {burn.number}
            </th>
            <td className={`${cell} whitespace-nowrap font-mono text-xs`}>
              <Timestamp value={burn.measured_at} seconds />
            </td>
            <td className={`${cell} text-right font-mono text-xs`}>{burn.source_line ?? '—'}</td>
            <BurnState burn={burn} onToggle={onToggle} />
            {elements.map((el) => {
              const value = burn.values[el];
              const shown = value && (shownView === 'corrected' && value.corrected ? value.corrected : value);
              return (
                <td
                  key={el}
                  data-element={el}
                  className={`${cell} whitespace-nowrap text-right font-mono tabular-nums ${burn.excluded ? 'line-through decoration-oxide-600' : ''}`}
                  title={value && shown ? valueTitle(value, shown) : 'Not measured in this burn'}
                >
                  {shown ? burnFigure(shown, resultOf.get(el)?.decimals ?? null) : ''}
                </td>
              );
            })}
          </tr>
        ))}
        <tr className="bg-ash-50 font-semibold" data-testid="burns-mean-row">
          <th scope="row" className={`${cell} ${sticky} text-right text-xs`}>
            Mean
          </th>
          <td colSpan={3} className={`${cell} text-xs font-normal text-slag-700`}>
            of the included burns, {viewName}
            {shownView === 'corrected' ? ' (the result)' : ' (the raw mean)'}
          </td>
          {elements.map((el) => {
            const r = resultOf.get(el);
            const mean = r ? (shownView === 'corrected' ? r.mean : r.raw_mean) : null;
            // The balance is 100 % minus the others, not an average of its burns.
            const byDifference = r?.flags.includes('balance_by_difference');
            return (
              <td key={el} data-element={el} className={`${cell} whitespace-nowrap text-right font-mono tabular-nums`}>
                {byDifference ? (
                  <span className="font-sans text-xs font-normal text-slag-500">by difference</span>
                ) : r && mean !== null ? (
                  statistic(mean, r.decimals)
                ) : (
                  ''
                )}
              </td>
            );
          })}
        </tr>
      </ScrollingTable>
    </div>
  );
}
