// Per-element corrections of a run. A flagged row carries its flag as icon and word and lists
// its reasons in full; the row tint only repeats that.
import { Table } from '../../../components/ui/layout.tsx';
import type { ElementCorrection } from '../api/standardizations.ts';
import { shortDecimal } from '../chart-data.ts';
import { FlagBadge } from './flag-badge.tsx';

const ROW_TINT = { ok: '', warn: 'bg-ember-500/5', fail: 'bg-oxide-50' };

export function CorrectionsTable({ corrections }: { corrections: ElementCorrection[] }) {
  return (
    <Table
      head={['Element', 'Slope', 'Offset (%)', 'Previous slope', 'Previous offset (%)', 'Flag', 'Reasons']}
      caption="Corrections per element"
    >
      {corrections.map((c) => (
        <tr key={c.element} className={ROW_TINT[c.flag]} data-testid="correction-row" data-flag={c.flag}>
          <th scope="row" className="px-3 py-2 text-left font-semibold">
            {c.element}
          </th>
          <td className="px-3 py-2 font-mono text-xs" title={c.slope ?? 'not corrected'}>
            {c.slope === null ? 'not corrected' : shortDecimal(c.slope)}
          </td>
          <td className="px-3 py-2 font-mono text-xs" title={c.offset ?? undefined}>
            {shortDecimal(c.offset)}
          </td>
          <td className="px-3 py-2 font-mono text-xs text-slag-500">{shortDecimal(c.previous_slope)}</td>
          <td className="px-3 py-2 font-mono text-xs text-slag-500">{shortDecimal(c.previous_offset)}</td>
          <td className="px-3 py-2">
            <FlagBadge flag={c.flag} />
          </td>
          <td className="px-3 py-2 text-xs text-slag-800">
            {c.reasons.length === 0 ? (
              <span className="text-slag-500">—</span>
            ) : (
              <ul className="list-disc space-y-0.5 pl-4">
                {c.reasons.map((reason) => (
                  <li key={reason}>{reason}</li>
                ))}
              </ul>
            )}
          </td>
        </tr>
      ))}
    </Table>
  );
}
