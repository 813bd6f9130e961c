import type { ElementResult } from '../api/samples.ts';
import { plain, reportedFigure, reportingStep, rsdFigure, statistic } from '../figures.ts';
import { FlagList } from './flag-badges.tsx';
import { ScrollingTable } from './scrolling-table.tsx';

// Flags come right after the reported value, so they are in view on a tablet before the statistics.
const cell = 'px-2.5 py-2';
const figure = `${cell} text-right font-mono tabular-nums whitespace-nowrap`;
const right = (text: string) => (
  <span key={text} className="block text-right">
    {text}
  </span>
);

/** Why nothing is reported, in a word, when a rule withheld the value (the flag explains it in full). */
function notReported(flags: readonly string[]): string | null {
  if (flags.includes('mixed_qualified_burns')) return 'withheld';
  if (flags.includes('not_in_method')) return 'not reported';
  return null;
}

/** A statistic with guard digits; the full value on hover. */
function Stat({ value, decimals }: { value: number | null; decimals: number }) {
  return <span title={value === null ? undefined : plain(value)}>{statistic(value, decimals)}</span>;
}

export function ResultsTable({ results, unit }: { results: ElementResult[]; unit: string }) {
  return (
    <ScrollingTable
      label="Results"
      caption={`Results per element, in ${unit}`}
      head={[
        'Element',
        right(`Reported (${unit})`),
        right('Step'),
        'Flags',
        right('Mean'),
        right('SD'),
        right('RSD %'),
        right('n'),
        right('Min'),
        right('Max'),
        right('Raw mean'),
      ]}
    >
      {results.map((r) => (
        <tr key={r.element} className="align-top" data-testid="result-row" data-element={r.element}>
          <th scope="row" className={`${cell} sticky left-0 z-10 bg-white font-mono font-semibold shadow-[1px_0_0_var(--color-ash-200)]`}>
            {r.element}
          </th>
          <td className={`${figure} font-semibold`} data-testid="reported">
            {r.reported === null && notReported(r.flags) ? (
              <span className="font-sans text-xs font-normal text-slag-500">{notReported(r.flags)}</span>
            ) : (
              reportedFigure(r)
            )}
          </td>
          <td
            className={`${figure} text-xs text-slag-500`}
            data-testid="step"
            title={`Rounded half to even to steps of ${reportingStep(r.decimals)} ${unit}`}
          >
            {reportingStep(r.decimals)}
          </td>
          <td className={`${cell} min-w-44`}>
            <FlagList flags={r.flags} />
          </td>
          <td className={figure}>
            <Stat value={r.mean} decimals={r.decimals} />
          </td>
          <td className={figure}>
            <Stat value={r.sd} decimals={r.decimals} />
          </td>
          <td className={figure}>{rsdFigure(r.rsd)}</td>
          <td className={figure} data-testid="n">
            {r.n}
          </td>
          <td className={figure}>
            <Stat value={r.min} decimals={r.decimals} />
          </td>
          <td className={figure}>
            <Stat value={r.max} decimals={r.decimals} />
          </td>
          <td className={figure}>
            <Stat value={r.raw_mean} decimals={r.decimals} />
          </td>
        </tr>
      ))}
    </ScrollingTable>
  );
}
