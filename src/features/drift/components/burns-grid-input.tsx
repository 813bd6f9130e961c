// The burns of one reference as a grid to type or correct: one row per burn, one cell per element
// of the method. Values from the instrument's file land here for checking; a block copied from a
// spreadsheet can be pasted into any cell. Cells the server could not read are outlined and say why.
import type { ClipboardEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { type BurnRow, isGridPaste, pasteIntoRows } from '../burns-grid.ts';

export function BurnsGridInput({
  label,
  elements,
  rows,
  onChange,
  cellErrors,
  unit,
}: {
  /** Names the grid and every cell for screen readers and tests, e.g. "High reference". */
  label: string;
  elements: readonly string[];
  rows: BurnRow[];
  onChange: (rows: BurnRow[]) => void;
  /** Messages keyed "row|element". */
  cellErrors: ReadonlyMap<string, string>;
  unit: string;
}) {
  const setCell = (row: number, element: string, text: string) => onChange(rows.map((r, i) => (i === row ? { ...r, [element]: text } : r)));

  function paste(event: ClipboardEvent<HTMLInputElement>, row: number, element: string) {
    const text = event.clipboardData.getData('text/plain');
    if (!isGridPaste(text)) return;
    event.preventDefault();
    onChange(pasteIntoRows(rows, row, element, text, elements));
  }

  return (
    <div className="space-y-2">
      <div className="relative max-w-full overflow-x-auto rounded-md border border-ash-200" data-testid="burns-grid">
        <table className="text-sm" aria-label={`${label}: burns (${unit})`}>
          <thead className="bg-ash-100 text-xs text-slag-500">
            <tr>
              <th scope="col" className="sticky left-0 z-10 bg-ash-100 px-2 py-1.5 text-left font-semibold">
                Burn
              </th>
              {elements.map((element) => (
                <th key={element} scope="col" className="px-1 py-1.5 text-right font-semibold">
                  {element}
                </th>
              ))}
              <th scope="col" className="px-2 py-1.5">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ash-100 bg-white">
            {rows.map((row, i) => (
              <tr key={i}>
                <th scope="row" className="sticky left-0 z-10 bg-white px-2 py-1 text-left text-xs font-medium text-slag-500">
                  {i + 1}
                </th>
                {elements.map((element) => {
                  const error = cellErrors.get(`${i}|${element}`);
                  return (
                    <td key={element} className="px-1 py-1">
                      <input
                        aria-label={`${label}, burn ${i + 1}, ${element}`}
                        aria-invalid={error ? true : undefined}
                        title={error}
                        inputMode="decimal"
                        autoComplete="off"
                        spellCheck={false}
                        value={row[element] ?? ''}
                        onChange={(e) => setCell(i, element, e.target.value)}
                        onPaste={(e) => paste(e, i, element)}
                        className={`w-20 rounded border px-1.5 py-1 text-right font-mono text-xs focus:border-ember-500 focus:outline-none ${
                          error ? 'border-oxide-600 bg-oxide-50' : 'border-ash-200'
                        }`}
                      />
                    </td>
                  );
                })}
                <td className="px-2 py-1">
                  <button
                    type="button"
                    className="rounded px-1.5 text-slag-500 hover:bg-ash-100 hover:text-oxide-600 disabled:opacity-40"
                    aria-label={`${label}: remove burn ${i + 1}`}
                    disabled={rows.length === 1}
                    onClick={() => onChange(rows.filter((_, j) => j !== i))}
                  >
                    ✕
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-2 text-xs text-slag-500">
        <span>
          Values in {unit} as measured (uncorrected): <code>0.452</code>, <code>&lt;0.002</code>, <code>n.d.</code>; an empty row is left
          out. Paste a block copied from a spreadsheet into any cell.
        </span>
        <Button type="button" variant="secondary" onClick={() => onChange([...rows, {}])}>
          Add a burn
        </Button>
      </div>
    </div>
  );
}
