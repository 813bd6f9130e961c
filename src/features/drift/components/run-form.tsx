// Runs a standardization from burns typed (or pasted) as JSON, one array per reference:
// [{"C": 0.80, "Mn": 1.47}, …]. A first version: reading the burns from a result file is left for later.
import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { ApiProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SelectField, TextField } from '../../../components/ui/field.tsx';
import { type Instrument, type Method, type ReferenceMaterial } from '../../../api/lookups.ts';
import { type CreateStandardizationRequest, useCreateRun } from '../api/standardizations.ts';
import { parseBurnsJson } from '../burns-json.ts';
import { paths } from '../../../config/paths.ts';

type Mode = CreateStandardizationRequest['mode'];
const MODES: { value: Mode; label: string; kinds: ReferenceMaterial['kind'][][] }[] = [
  { value: 'two_point', label: 'Two-point (high and low reference)', kinds: [['high'], ['low']] },
  { value: 'one_point_factor', label: 'One-point factor', kinds: [['high', 'low', 'type']] },
  { value: 'one_point_offset', label: 'One-point offset', kinds: [['high', 'low', 'type']] },
  { value: 'type', label: 'Type standardization (similar composition)', kinds: [['type']] },
];

function ReferenceBurns({
  index,
  label,
  options,
  referenceId,
  onReference,
  text,
  onText,
  error,
}: {
  index: number;
  label: string;
  options: ReferenceMaterial[];
  referenceId: string;
  onReference: (id: string) => void;
  text: string;
  onText: (text: string) => void;
  error?: string;
}) {
  return (
    <fieldset className="space-y-3 rounded-lg border border-ash-200 bg-white p-4">
      <legend className="px-1 text-sm font-semibold text-slag-800">{label}</legend>
      <SelectField label={`Reference material ${index + 1}`} value={referenceId} onChange={(e) => onReference(e.target.value)}>
        <option value="">Choose…</option>
        {options.map((r) => (
          <option key={r.id} value={r.id}>
            {r.code} — {r.name} ({r.kind})
          </option>
        ))}
      </SelectField>
      <div className="space-y-1">
        <label htmlFor={`burns-${index}`} className="block text-sm font-medium text-slag-800">
          Burns of reference {index + 1} (JSON, % unless the method says otherwise)
        </label>
        <textarea
          id={`burns-${index}`}
          rows={5}
          value={text}
          onChange={(e) => onText(e.target.value)}
          aria-invalid={error ? true : undefined}
          className="w-full rounded-md border border-ash-200 bg-white px-3 py-2 font-mono text-xs focus:border-ember-500 focus:outline-none"
          placeholder='[{"C": 0.80, "Mn": 1.47}, {"C": 0.81, "Mn": 1.48}]'
        />
        {error && (
          <p role="alert" className="text-xs font-medium text-oxide-600">
            ⚠ {error}
          </p>
        )}
      </div>
    </fieldset>
  );
}

export function RunForm({
  instruments,
  methods,
  references,
}: {
  instruments: Instrument[];
  methods: Method[];
  references: ReferenceMaterial[];
}) {
  const [instrumentId, setInstrumentId] = useState(instruments[0]?.id ?? '');
  const [methodId, setMethodId] = useState(methods[0]?.id ?? '');
  const [mode, setMode] = useState<Mode>('two_point');
  const [refIds, setRefIds] = useState(['', '']);
  const [texts, setTexts] = useState(['', '']);
  const [jsonErrors, setJsonErrors] = useState<(string | undefined)[]>([]);
  const [note, setNote] = useState('');
  const create = useCreateRun();
  const navigate = useNavigate();
  const method = methods.find((m) => m.id === methodId);
  const kinds = MODES.find((m) => m.value === mode)!.kinds;

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = kinds.map((_, i) => parseBurnsJson(texts[i]));
    setJsonErrors(parsed.map((p) => p.error));
    if (parsed.some((p) => p.error)) return;
    const body: CreateStandardizationRequest = {
      method_id: methodId,
      mode,
      ...(note.trim() ? { note: note.trim() } : {}),
      measurements: kinds.map((_, i) => ({ reference_material_id: refIds[i], burns: parsed[i].burns!.map((values) => ({ values })) })),
    };
    create.mutate({ instrumentId, body }, { onSuccess: (run) => navigate(paths.driftRun(run.id)) });
  }

  const problem = create.error instanceof ApiProblem ? create.error : undefined;
  return (
    <form onSubmit={submit} className="max-w-3xl space-y-4" noValidate>
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField label="Instrument" value={instrumentId} onChange={(e) => setInstrumentId(e.target.value)}>
          {instruments.map((i) => (
            <option key={i.id} value={i.id}>
              {i.code} — {i.name}
            </option>
          ))}
        </SelectField>
        <SelectField label="Method" value={methodId} onChange={(e) => setMethodId(e.target.value)} error={problem?.fieldError('method_id')}>
          {methods.map((m) => (
            <option key={m.id} value={m.id}>
              {m.code} ({m.matrix} base)
            </option>
          ))}
        </SelectField>
        <SelectField label="Mode" value={mode} onChange={(e) => setMode(e.target.value as Mode)}>
          {MODES.map((m) => (
            <option key={m.value} value={m.value}>
              {m.label}
            </option>
          ))}
        </SelectField>
      </div>
      {kinds.map((allowed, i) => (
        <ReferenceBurns
          key={`${mode}-${i}`}
          index={i}
          label={mode === 'two_point' ? (i === 0 ? 'High reference' : 'Low reference') : 'Reference'}
          options={references.filter((r) => allowed.includes(r.kind) && (!method || r.matrix === method.matrix))}
          referenceId={refIds[i]}
          onReference={(id) => setRefIds((ids) => ids.map((x, j) => (j === i ? id : x)))}
          text={texts[i]}
          onText={(text) => setTexts((all) => all.map((x, j) => (j === i ? text : x)))}
          error={jsonErrors[i]}
        />
      ))}
      <TextField label="Note (optional)" value={note} onChange={(e) => setNote(e.target.value)} />
      <ProblemAlert error={create.error} fields={['method_id']} />
      <div className="flex justify-end">
        <Button type="submit" disabled={create.isPending}>
          Compute corrections
        </Button>
      </div>
    </form>
  );
}
