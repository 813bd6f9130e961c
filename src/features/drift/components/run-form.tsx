// Runs a standardization: the references' burns read from the instrument's result file (each
// sample of the file mapped to a reference material) or typed into a grid, checked and corrected
// there, with the measurement time from the file. The method defaults to the one the instrument
// was last standardized with; the server computes and flags the corrections and stores a draft.
import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { ApiProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SelectField, TextField } from '../../../components/ui/field.tsx';
import { type ImportProfile, type Instrument, type Method, type ReferenceMaterial } from '../../../api/lookups.ts';
import { type CreateStandardizationRequest, useCorrectionsInForce, useCreateRun, useRuns } from '../api/standardizations.ts';
import { cellErrorsOf, emptySlots, fillSlots, type Mode, MODES, type Slot, slotsOf } from '../run-slots.ts';
import type { StandardizationFileReading } from '../api/standardization-file.ts';
import { burnsFromRows } from '../burns-grid.ts';
import { formatTime } from '../chart-data.ts';
import { initialMapping, mappedMeasuredAt, mappedReferences } from '../file-mapping.ts';
import { BurnsGridInput } from './burns-grid-input.tsx';
import { FileReadingPanel } from './file-reading-panel.tsx';
import { paths } from '../../../config/paths.ts';

/** An instant with its zone, as the API takes it: 2026-11-30T06:05Z or 2026-11-30T07:05:00+01:00. */
const ISO_WITH_ZONE = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;

/** The method the instrument was last standardized with, else the first with a set in force. */
function useInstrumentMethodId(instrumentId: string): { methodId?: string; pending: boolean } {
  const runs = useRuns(instrumentId);
  const inForce = useCorrectionsInForce(instrumentId);
  const latest = runs.data?.pages[0]?.data[0]?.method.id;
  return { methodId: latest ?? inForce.data?.data[0]?.method.id, pending: runs.isPending || inForce.isPending };
}

export function RunForm({
  instruments,
  methods,
  references,
  profiles,
}: {
  instruments: Instrument[];
  methods: Method[];
  references: ReferenceMaterial[];
  profiles: ImportProfile[];
}) {
  const [instrumentId, setInstrumentId] = useState(instruments[0]?.id ?? '');
  const [chosenMethodId, setChosenMethodId] = useState('');
  const own = useInstrumentMethodId(instrumentId);
  const methodId = chosenMethodId || own.methodId || methods[0]?.id || '';
  const [mode, setMode] = useState<Mode>('two_point');
  const [slots, setSlots] = useState<Slot[]>(emptySlots);
  const [reading, setReading] = useState<StandardizationFileReading | null>(null);
  const [mapping, setMapping] = useState<string[]>([]);
  const [measuredAt, setMeasuredAt] = useState('');
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const [note, setNote] = useState('');
  const create = useCreateRun();
  const navigate = useNavigate();
  const method = methods.find((m) => m.id === methodId);
  const elements = method?.elements.map((e) => e.element) ?? [];
  const usable = references.filter((r) => r.kind !== 'control' && (!method || r.matrix === method.matrix));
  const modeSlots = slotsOf(mode);

  function startOver(next: { instrumentId?: string; methodId?: string }) {
    if (next.instrumentId !== undefined) setInstrumentId(next.instrumentId);
    setChosenMethodId(next.methodId ?? '');
    setReading(null);
    setMapping([]);
    setSlots(emptySlots());
    setMeasuredAt('');
    create.reset();
  }

  /** Fills each reference of the mode from the samples mapped to a reference of a fitting kind. */
  function applyMapping(file: StandardizationFileReading, next: string[], forMode: Mode) {
    setMapping(next);
    const kindOf = (id: string) => references.find((r) => r.id === id)?.kind;
    const filled = fillSlots(mappedReferences(file, next), kindOf, forMode, slots);
    setMode(filled.mode);
    setSlots(filled.slots);
    const at = mappedMeasuredAt(file, next);
    if (at) setMeasuredAt(at);
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    const errors: Record<string, string> = {};
    const read = modeSlots.map((_, i) => burnsFromRows(slots[i].rows));
    modeSlots.forEach((_, i) => {
      if (!slots[i].referenceId) errors[`ref${i}`] = 'Choose the reference material these burns were sparked on.';
      if (read[i].error) errors[`burns${i}`] = read[i].error!;
    });
    if (measuredAt.trim() && !ISO_WITH_ZONE.test(measuredAt.trim()))
      errors.measuredAt = 'Write it as 2026-11-30T06:05Z (UTC) or with its offset, e.g. 2026-11-30T07:05+01:00.';
    setLocalErrors(errors);
    if (Object.keys(errors).length) return;
    const body: CreateStandardizationRequest = {
      method_id: methodId,
      mode,
      unit: '%',
      ...(measuredAt.trim() ? { measured_at: measuredAt.trim() } : {}),
      ...(note.trim() ? { note: note.trim() } : {}),
      ...(reading ? { source_file: { name: reading.file.name, sha256: reading.file.sha256 } } : {}),
      measurements: modeSlots.map((_, i) => ({
        reference_material_id: slots[i].referenceId,
        burns: read[i].burns!.map((values) => ({ values })),
      })),
    };
    create.mutate({ instrumentId, body }, { onSuccess: (run) => navigate(paths.driftRun(run.id)) });
  }

  const problem = create.error instanceof ApiProblem ? create.error : undefined;
  const cellErrors = cellErrorsOf(problem, slots);
  return (
    <form onSubmit={submit} className="max-w-5xl space-y-4" noValidate>
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField label="Instrument" value={instrumentId} onChange={(e) => startOver({ instrumentId: e.target.value })}>
          {instruments.map((i) => (
            <option key={i.id} value={i.id}>
              {i.code} — {i.name}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Method"
          value={methodId}
          onChange={(e) => startOver({ methodId: e.target.value })}
          error={problem?.fieldError('method_id')}
          hint={!chosenMethodId && own.methodId ? 'The method this instrument was last standardized with.' : undefined}
        >
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
      <FileReadingPanel
        key={`${instrumentId}|${methodId}`}
        instrumentId={instrumentId}
        methodId={methodId}
        profiles={profiles}
        references={usable}
        reading={reading}
        mapping={mapping}
        onRead={(file) => {
          setReading(file);
          applyMapping(file, initialMapping(file), mode);
        }}
        onMapping={(next) => reading && applyMapping(reading, next, mode)}
      />
      {modeSlots.map((slot, i) => (
        <fieldset key={`${mode}-${i}`} className="min-w-0 space-y-3 rounded-lg border border-ash-200 bg-white p-4">
          <legend className="px-1 text-sm font-semibold text-slag-800">{slot.label}</legend>
          <div className="max-w-md">
            <SelectField
              label={`Reference material ${i + 1}`}
              value={slots[i].referenceId}
              onChange={(e) => setSlots((all) => all.map((s, j) => (j === i ? { ...s, referenceId: e.target.value } : s)))}
              error={localErrors[`ref${i}`] ?? problem?.fieldError(`measurements.${i}.reference_material_id`)}
            >
              <option value="">Choose…</option>
              {usable
                .filter((r) => slot.kinds.includes(r.kind))
                .map((r) => (
                  <option key={r.id} value={r.id}>
                    {r.code} — {r.name} ({r.kind})
                  </option>
                ))}
            </SelectField>
          </div>
          <BurnsGridInput
            label={slot.label}
            elements={elements}
            rows={slots[i].rows}
            onChange={(rows) => setSlots((all) => all.map((s, j) => (j === i ? { ...s, rows } : s)))}
            cellErrors={cellErrors[i]}
            unit="%"
          />
          {localErrors[`burns${i}`] && (
            <p role="alert" className="text-xs font-medium text-oxide-600">
              ⚠ {localErrors[`burns${i}`]}
            </p>
          )}
        </fieldset>
      ))}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Measured at (ISO 8601 with zone)"
          value={measuredAt}
          placeholder="2026-11-30T06:05Z"
          onChange={(e) => setMeasuredAt(e.target.value)}
          error={localErrors.measuredAt ?? problem?.fieldError('measured_at')}
          hint={
            measuredAt && ISO_WITH_ZONE.test(measuredAt)
              ? `${formatTime(measuredAt)}${reading ? ', the latest burn of the file' : ''}.`
              : 'When the references were sparked; empty means now.'
          }
        />
        <TextField label="Note (optional)" value={note} onChange={(e) => setNote(e.target.value)} />
      </div>
      <ProblemAlert
        error={create.error}
        fields={[
          'method_id',
          'measured_at',
          ...modeSlots.flatMap((_, i) => [`measurements.${i}.reference_material_id`, `measurements.${i}.burns`]),
        ]}
      />
      {cellErrors.some((m) => m.size > 0) && (
        <p role="alert" className="text-xs font-medium text-oxide-600">
          ⚠ {cellErrors.reduce((n, m) => n + m.size, 0)} value(s) cannot be read; they are outlined in the grid:{' '}
          {cellErrors.flatMap((m) => [...m.values()]).join(' ')}
        </p>
      )}
      <div className="flex justify-end">
        <Button type="submit" disabled={create.isPending || !method}>
          Compute corrections
        </Button>
      </div>
    </form>
  );
}
