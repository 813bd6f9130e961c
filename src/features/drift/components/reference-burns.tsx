// One reference's burns of a run, as measured (uncorrected), opened on request: the values as the
// instrument or the analyst wrote them, with their unit when not %.
import type { Standardization } from '../api/standardizations.ts';

type Measurement = Standardization['measurements'][number];

export function ReferenceBurns({ measurement }: { measurement: Measurement }) {
  const { reference_material: reference, burns } = measurement;
  const elements = [...new Set(burns.flatMap((b) => Object.keys(b.values)))];
  return (
    <details className="rounded-md border border-ash-200" data-testid="reference-burns">
      <summary className="cursor-pointer px-3 py-2 text-sm">
        <strong>{reference.code}</strong> ({reference.kind}) — {burns.length} burn{burns.length === 1 ? '' : 's'}
      </summary>
      <div className="relative max-w-full overflow-x-auto border-t border-ash-200">
        <table className="text-xs" aria-label={`Burns of ${reference.code}, as measured`}>
          <thead className="bg-ash-100 text-slag-500">
            <tr>
              <th scope="col" className="sticky left-0 bg-ash-100 px-2 py-1 text-left">
                Burn
              </th>
              {elements.map((element) => (
                <th key={element} scope="col" className="px-2 py-1 text-right">
                  {element}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-ash-100">
            {burns.map((burn, i) => (
              <tr key={i}>
                <th scope="row" className="sticky left-0 bg-white px-2 py-1 text-left font-medium text-slag-500">
                  {i + 1}
                </th>
                {elements.map((element) => {
                  const cell = burn.values[element];
                  return (
                    <td key={element} className="px-2 py-1 text-right font-mono whitespace-nowrap" title={cell?.value ?? undefined}>
                      {cell ? `${cell.raw}${cell.raw_unit === '%' ? '' : ` ${cell.raw_unit}`}` : ''}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
