// Which events e-mail me: per kind, every instrument or only some. Saved as a whole (PUT).
import { useState, type FormEvent } from 'react';
import type { Instrument } from '../../../api/lookups.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { ALERT_KIND_LABELS, type AlertKind, type AlertPreference, useSaveAlertPreferences } from '../api/alert-preferences.ts';

const ALL = '*';
const keyOf = (p: AlertPreference) => `${p.kind}|${p.instrument_id ?? ALL}`;

interface Props {
  initial: AlertPreference[];
  groupMinutes: number;
  instruments: Instrument[];
}

export function AlertPreferencesForm({ initial, groupMinutes, instruments }: Props) {
  const [chosen, setChosen] = useState(() => new Set(initial.map(keyOf)));
  const save = useSaveAlertPreferences();
  const toggle = (key: string, on: boolean) => {
    save.reset();
    setChosen((current) => {
      const next = new Set(current);
      if (on) next.add(key);
      else next.delete(key);
      return next;
    });
  };
  function submit(event: FormEvent) {
    event.preventDefault();
    const data = [...chosen].map((key) => {
      const [kind, instrument] = key.split('|');
      return { kind: kind as AlertKind, instrument_id: instrument === ALL ? null : instrument };
    });
    save.mutate(data);
  }
  return (
    <form onSubmit={submit} className="space-y-4">
      {(Object.keys(ALERT_KIND_LABELS) as AlertKind[]).map((kind) => {
        const all = chosen.has(`${kind}|${ALL}`);
        return (
          <fieldset key={kind} className="rounded-lg border border-ash-200 bg-white px-4 py-3" data-testid={`alert-kind-${kind}`}>
            <legend className="px-1 text-sm font-semibold text-slag-800">{ALERT_KIND_LABELS[kind]}</legend>
            <div className="flex flex-wrap gap-x-6 gap-y-2 text-sm">
              <label className="flex items-center gap-2">
                <input type="checkbox" checked={all} onChange={(e) => toggle(`${kind}|${ALL}`, e.target.checked)} />
                Every instrument
              </label>
              {instruments.map((i) => (
                <label key={i.id} className={`flex items-center gap-2 ${all ? 'text-slag-300' : ''}`}>
                  <input
                    type="checkbox"
                    disabled={all}
                    checked={all || chosen.has(`${kind}|${i.id}`)}
                    onChange={(e) => toggle(`${kind}|${i.id}`, e.target.checked)}
                  />
                  {i.code}
                </label>
              ))}
            </div>
          </fieldset>
        );
      })}
      <p className="text-xs text-slag-500">Alerts that arrive within {groupMinutes} minutes of each other come as one message.</p>
      <ProblemAlert error={save.error} />
      {save.isSuccess && <Alert tone="success" title="Saved: these events e-mail you from now on." />}
      <Button type="submit" disabled={save.isPending}>
        {save.isPending ? 'Saving…' : 'Save my alerts'}
      </Button>
    </form>
  );
}
