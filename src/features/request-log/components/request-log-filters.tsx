import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { SelectField, TextField } from '../../../components/ui/field.tsx';
import type { RequestLogFilters } from '../api/request-log.ts';
import { DateTimeField } from '../../../components/ui/date-field.tsx';
import { readIsoDateTime } from '../../../lib/iso-date.ts';

const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;
const EMPTY = { method: '', status: '', path_prefix: '', caller_id: '', since: '', until: '' };

/** A time typed in the reader's zone (yyyy-mm-dd hh:mm); the API wants UTC. */
function toIso(local: string): string | undefined {
  return readIsoDateTime(local)?.toISOString();
}

export function RequestLogFilterForm({ onApply }: { onApply: (filters: RequestLogFilters) => void }) {
  const [form, setForm] = useState(EMPTY);
  const [includeConsole, setIncludeConsole] = useState(false);
  const set = (field: keyof typeof EMPTY) => (event: { target: { value: string } }) =>
    setForm((f) => ({ ...f, [field]: event.target.value }));

  function apply(withConsole: boolean) {
    // A time that is not yyyy-mm-dd hh:mm is not applied; its field says why.
    if ([form.since, form.until].some((text) => text.trim() !== '' && !toIso(text))) return;
    onApply({
      method: (form.method || undefined) as RequestLogFilters['method'],
      status: form.status.trim() || undefined,
      path_prefix: form.path_prefix.trim() || undefined,
      caller_id: form.caller_id.trim() || undefined,
      since: toIso(form.since),
      until: toIso(form.until),
      include_console: withConsole ? 'true' : undefined,
    });
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    apply(includeConsole);
  }

  return (
    <form
      onSubmit={submit}
      className="grid grid-cols-2 items-end gap-3 rounded-lg border border-ash-200 bg-white p-4 md:grid-cols-4 xl:grid-cols-7"
      aria-label="Filters"
    >
      <SelectField label="Method" value={form.method} onChange={set('method')}>
        <option value="">any</option>
        {METHODS.map((m) => (
          <option key={m}>{m}</option>
        ))}
      </SelectField>
      <TextField label="Status" placeholder="404 or 4xx" value={form.status} onChange={set('status')} />
      <TextField label="Path starts with" placeholder="/api/v1/samples" value={form.path_prefix} onChange={set('path_prefix')} />
      <TextField label="Caller id" placeholder="key_… or usr_…" value={form.caller_id} onChange={set('caller_id')} />
      <DateTimeField label="Since" value={form.since} onChange={set('since')} />
      <DateTimeField label="Until" value={form.until} onChange={set('until')} />
      <div className="flex gap-2">
        <Button type="submit">Apply</Button>
        <Button
          variant="secondary"
          onClick={() => {
            setForm(EMPTY);
            setIncludeConsole(false);
            onApply({});
          }}
        >
          Reset
        </Button>
      </div>
      <label className="col-span-full flex items-center gap-2 text-sm text-slag-700">
        <input
          type="checkbox"
          className="accent-ember-600"
          checked={includeConsole}
          onChange={(event) => {
            setIncludeConsole(event.target.checked);
            apply(event.target.checked);
          }}
        />
        Show the console&apos;s own calls (its pages loading and refreshing; hidden by default)
      </label>
    </form>
  );
}
