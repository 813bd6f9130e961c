import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { SelectField, TextField } from '../../../components/ui/field.tsx';
import { useInstruments, useMethods } from '../../../api/lookups.ts';
import { SAMPLE_KINDS, SAMPLE_STATUSES, type SampleFilters, VERDICT_LABELS, VERDICTS } from '../filters.ts';
import { flagInfo, RESULT_FLAG_NAMES } from '../result-flags.ts';
import { InstrumentOptions, MethodOptions } from '../../../components/lookup-options.tsx';
import { DateField } from '../../../components/ui/date-field.tsx';

type Draft = Record<Exclude<keyof SampleFilters, 'import_id' | 'controls' | 'exclude_kind'>, string>;

function draftOf(filters: SampleFilters): Draft {
  return {
    sample_code: filters.sample_code ?? '',
    heat: filters.heat ?? '',
    grade: filters.grade ?? '',
    instrument_id: filters.instrument_id ?? '',
    method_id: filters.method_id ?? '',
    kind: filters.kind ?? '',
    status: filters.status ?? '',
    conforms: filters.conforms ?? '',
    flag: filters.flag ?? '',
    created_from: filters.created_from ?? '',
    created_to: filters.created_to ?? '',
  };
}

/**
 * Edits a draft of the filters; Apply hands them over (the page puts them in the URL). Mount it
 * with a key of the URL query so Back/Forward and shared links refill it.
 */
export function SampleFilterForm({ filters, onApply }: { filters: SampleFilters; onApply: (filters: SampleFilters) => void }) {
  const [draft, setDraft] = useState(() => draftOf(filters));
  const instruments = useInstruments();
  const methods = useMethods();
  const set = (field: keyof Draft) => (event: { target: { value: string } }) => setDraft((d) => ({ ...d, [field]: event.target.value }));

  function submit(event: FormEvent) {
    event.preventDefault();
    // Text is trimmed and blanks dropped when the page writes the URL (writeFilters).
    onApply({ ...(filters.import_id ? { import_id: filters.import_id } : {}), ...(draft as SampleFilters) });
  }

  return (
    <form
      onSubmit={submit}
      aria-label="Sample filters"
      title="Days are in your time zone"
      className="grid grid-cols-2 items-end gap-3 rounded-lg border border-ash-200 bg-white p-4 md:grid-cols-4 xl:grid-cols-6"
    >
      <TextField label="Sample code" value={draft.sample_code} onChange={set('sample_code')} placeholder="K24-0412-F1" />
      <TextField label="Heat" value={draft.heat} onChange={set('heat')} placeholder="K24-0412" />
      <TextField label="Grade" value={draft.grade} onChange={set('grade')} placeholder="SAE 1045" />
      <SelectField
        label="Instrument"
        value={draft.instrument_id}
        onChange={set('instrument_id')}
        hint={instruments.error ? 'Instruments could not be loaded.' : undefined}
      >
        <option value="">any</option>
        <InstrumentOptions instruments={instruments.data} />
      </SelectField>
      <SelectField
        label="Method"
        value={draft.method_id}
        onChange={set('method_id')}
        hint={methods.error ? 'Methods could not be loaded.' : undefined}
      >
        <option value="">any</option>
        <MethodOptions methods={methods.data} />
      </SelectField>
      <SelectField label="Kind" value={draft.kind} onChange={set('kind')}>
        <option value="">any</option>
        {SAMPLE_KINDS.map((kind) => (
          <option key={kind}>{kind}</option>
        ))}
      </SelectField>
      <SelectField label="Status" value={draft.status} onChange={set('status')}>
        <option value="">any</option>
        {SAMPLE_STATUSES.map((status) => (
          <option key={status}>{status}</option>
        ))}
      </SelectField>
      <SelectField label="Verdict" value={draft.conforms} onChange={set('conforms')}>
        <option value="">any</option>
        {VERDICTS.map((verdict) => (
          <option key={verdict} value={verdict}>
            {VERDICT_LABELS[verdict]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Flag" value={draft.flag} onChange={set('flag')}>
        <option value="">any</option>
        {RESULT_FLAG_NAMES.map((name) => (
          <option key={name} value={name}>
            {flagInfo(name).label}
          </option>
        ))}
      </SelectField>
      <DateField label="Created from" value={draft.created_from} onChange={set('created_from')} />
      <DateField label="Created to (included)" value={draft.created_to} onChange={set('created_to')} />
      <div className="flex gap-2 xl:col-span-2">
        <Button type="submit">Apply filters</Button>
        <Button variant="secondary" onClick={() => onApply({})}>
          Reset
        </Button>
      </div>
    </form>
  );
}
