import { OUTPUT_UNITS, type OutputUnit } from '../filters.ts';

const NAMES: Record<OutputUnit, string> = { '%': '% (mass)', ppm: 'ppm (mg/kg)', ppb: 'ppb (µg/kg)' };

/** Radio buttons (arrow keys move between them) styled as a segmented control. */
export function UnitSwitch({ value, onChange }: { value: OutputUnit; onChange: (unit: OutputUnit) => void }) {
  return (
    <fieldset className="flex items-center gap-2">
      <legend className="float-left mr-2 text-sm font-medium text-slag-800">Unit</legend>
      <div className="inline-flex overflow-hidden rounded-md border border-ash-200 bg-white">
        {OUTPUT_UNITS.map((unit) => (
          <label
            key={unit}
            className="cursor-pointer border-r border-ash-200 last:border-r-0 has-[:checked]:bg-slag-900 has-[:checked]:text-white has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-ember-500"
          >
            <input type="radio" name="unit" value={unit} checked={value === unit} onChange={() => onChange(unit)} className="sr-only" />
            <span className="block px-3 py-1.5 text-sm" title={NAMES[unit]}>
              {unit}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
