import { SelectField } from '../../../components/ui/field.tsx';
import type { Instrument, Method } from '../../../api/lookups.ts';
import { InstrumentOptions, MethodOptions } from '../../../components/lookup-options.tsx';

export interface DriftSelection {
  instrumentId: string;
  methodId: string;
  element: string;
}

export function DriftFilters({
  instruments,
  methods,
  value,
  onChange,
}: {
  instruments: Instrument[];
  methods: Method[];
  value: DriftSelection;
  onChange: (next: DriftSelection) => void;
}) {
  const method = methods.find((m) => m.id === value.methodId);
  return (
    <div className="grid max-w-3xl gap-4 sm:grid-cols-3">
      <SelectField label="Instrument" value={value.instrumentId} onChange={(e) => onChange({ ...value, instrumentId: e.target.value })}>
        <InstrumentOptions instruments={instruments} />
      </SelectField>
      <SelectField
        label="Method"
        value={value.methodId}
        onChange={(e) =>
          onChange({
            ...value,
            methodId: e.target.value,
            element: methods.find((m) => m.id === e.target.value)?.elements[0]?.element ?? '',
          })
        }
      >
        <MethodOptions methods={methods} label={(m) => `${m.code} (${m.matrix} base)`} />
      </SelectField>
      <SelectField label="Element" value={value.element} onChange={(e) => onChange({ ...value, element: e.target.value })}>
        {method?.elements.map((e) => (
          <option key={e.element} value={e.element}>
            {e.element}
          </option>
        ))}
      </SelectField>
    </div>
  );
}
