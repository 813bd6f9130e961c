// Per-element corrections of a run, readable without the formulas: for each element the nominal
// value and the measured mean of each reference (with its number of burns), the slope and offset
// this run computed, those of the set before and how far the slope moved, and the flag. A flagged
// element carries its flag as icon and word (next to the element, always in view) and its reasons
// in full on the row below; the row tint only repeats that. Offsets are in the element's natural unit (ppm for trace elements).
import { Fragment } from 'react';
import type { ElementCorrection } from '../api/standardizations.ts';
import { changeFigure, levelFigure, offsetFigure, offsetUnit, slopeFigure } from '../figures.ts';
import { FlagBadge } from './flag-badge.tsx';

const ROW_TINT = { ok: '', warn: 'bg-ember-500/5', fail: 'bg-oxide-50' };
const NUM = 'px-1.5 py-1.5 text-right font-mono text-xs whitespace-nowrap';
const HEAD = [
  ['Element', 'text-left'],
  ['Flag', 'text-left'],
  ['Reference', 'text-left'],
  ['Nominal (%)', 'text-right'],
  ['Measured mean (%)', 'text-right'],
  ['Burns', 'text-right'],
  ['Slope', 'text-right'],
  ['Offset', 'text-right'],
  ['Before: slope · offset', 'text-right'],
  ['Slope moved', 'text-right'],
] as const;

export function CorrectionsTable({
  corrections,
  decimalsOf,
}: {
  corrections: ElementCorrection[];
  /** The method's reporting decimals of an element (in %). */
  decimalsOf: (element: string) => number;
}) {
  return (
    <div className="relative overflow-x-auto rounded-lg border border-ash-200 bg-white">
      <table className="min-w-full text-sm">
        <caption className="sr-only">Corrections per element</caption>
        <thead className="bg-ash-100 text-xs uppercase tracking-wide text-slag-500">
          <tr>
            {HEAD.map(([label, align]) => (
              <th key={label} scope="col" className={`px-2 py-2 font-semibold ${align}`}>
                {label}
              </th>
            ))}
          </tr>
        </thead>
        {corrections.map((c) => {
          const decimals = decimalsOf(c.element);
          const unit = offsetUnit(decimals);
          const span = Math.max(1, c.levels.length);
          return (
            <tbody
              key={c.element}
              className={`border-t border-ash-100 ${ROW_TINT[c.flag]}`}
              data-testid="correction-row"
              data-flag={c.flag}
            >
              {(c.levels.length ? c.levels : [null]).map((level, i) => (
                <tr key={level?.reference_material_id ?? i}>
                  {i === 0 && (
                    <Fragment>
                      <th scope="row" rowSpan={span} className="px-2 py-1.5 text-left align-top font-semibold">
                        {c.element}
                      </th>
                      <td rowSpan={span} className="px-2 py-1.5 align-top">
                        <FlagBadge flag={c.flag} />
                      </td>
                    </Fragment>
                  )}
                  <td className="px-2 py-1.5 font-mono text-xs whitespace-nowrap">{level?.code ?? '—'}</td>
                  <td className={NUM} title={level?.nominal ?? undefined}>
                    {level?.nominal ?? '—'}
                  </td>
                  <td className={NUM} title={level?.measured ?? undefined}>
                    {levelFigure(level?.measured ?? null, decimals)}
                  </td>
                  <td className={NUM}>{level?.n ?? '—'}</td>
                  {i === 0 && (
                    <Fragment>
                      <td rowSpan={span} className={`${NUM} align-top`} title={c.slope ?? 'not corrected'}>
                        {c.slope === null ? 'not corrected' : slopeFigure(c.slope)}
                      </td>
                      <td rowSpan={span} className={`${NUM} align-top`} title={c.offset === null ? undefined : `${c.offset} %`}>
                        {c.offset === null ? '—' : `${offsetFigure(c.offset, decimals)} ${unit}`}
                      </td>
                      <td
                        rowSpan={span}
                        className={`${NUM} align-top text-slag-500`}
                        title={c.previous_slope === null ? 'no set before' : `${c.previous_slope} · ${c.previous_offset ?? '—'} %`}
                      >
                        {c.previous_slope === null
                          ? 'none'
                          : `${slopeFigure(c.previous_slope)} · ${offsetFigure(c.previous_offset, decimals)} ${unit}`}
                      </td>
                      <td
                        rowSpan={span}
                        className={`${NUM} align-top`}
                        title={c.offset_change === null ? undefined : `offset moved ${c.offset_change} %`}
                        data-testid="slope-change"
                      >
                        {changeFigure(c.slope_change)}
                      </td>
                    </Fragment>
                  )}
                </tr>
              ))}
              {c.reasons.length > 0 && (
                <tr>
                  <td colSpan={HEAD.length} className="px-2 pb-2 text-xs text-slag-800">
                    {/* Kept in view when the table scrolls sideways, wrapped to the width of a tablet. */}
                    <ul className="sticky left-2 max-w-2xl list-disc space-y-0.5 pl-8">
                      {c.reasons.map((reason) => (
                        <li key={reason}>{reason}</li>
                      ))}
                    </ul>
                  </td>
                </tr>
              )}
            </tbody>
          );
        })}
      </table>
    </div>
  );
}
