import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { SelectField } from '../../../components/ui/field.tsx';
import { useImportProfiles, useInstruments, useMethods } from '../../../api/lookups.ts';
import { FileDropZone } from './file-drop-zone.tsx';
import { InstrumentOptions, MethodOptions } from '../../../components/lookup-options.tsx';

export interface UploadDraft {
  instrumentId: string;
  methodId: string;
  profileId: string;
  file: File | null;
}

export const EMPTY_DRAFT: UploadDraft = { instrumentId: '', methodId: '', profileId: '', file: null };

type Missing = Partial<Record<'instrumentId' | 'methodId' | 'file', string>>;

function missingIn(draft: UploadDraft): Missing {
  const missing: Missing = {};
  if (!draft.instrumentId) missing.instrumentId = 'Choose the instrument that measured these samples.';
  if (!draft.methodId) missing.methodId = 'Choose the method the results belong to.';
  if (!draft.file) missing.file = 'Choose or drop the result file.';
  return missing;
}

/** Step 1: instrument, method, optional profile and the file; "Preview" asks the server how it reads. */
export function UploadChoicesForm({
  draft,
  onChange,
  onPreview,
  busy,
}: {
  draft: UploadDraft;
  onChange: (draft: UploadDraft) => void;
  onPreview: () => void;
  busy: boolean;
}) {
  const instruments = useInstruments();
  const methods = useMethods();
  const profiles = useImportProfiles();
  const [missing, setMissing] = useState<Missing>({});

  function change(patch: Partial<UploadDraft>) {
    setMissing((m) => Object.fromEntries(Object.entries(m).filter(([key]) => !(key in patch))));
    onChange({ ...draft, ...patch });
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    const found = missingIn(draft);
    setMissing(found);
    if (Object.keys(found).length === 0) onPreview();
  }

  const loadError = instruments.error || methods.error ? 'The lists could not be loaded; reload the page.' : undefined;
  return (
    <form onSubmit={submit} noValidate aria-label="Upload" className="space-y-4 rounded-lg border border-ash-200 bg-white p-5">
      <div className="grid gap-4 md:grid-cols-3">
        <SelectField
          label="Instrument"
          value={draft.instrumentId}
          onChange={(e) => change({ instrumentId: e.target.value })}
          error={missing.instrumentId ?? loadError}
          disabled={busy}
        >
          <option value="">{instruments.isPending ? 'Loading…' : 'Choose an instrument…'}</option>
          <InstrumentOptions instruments={instruments.data} />
        </SelectField>
        <SelectField
          label="Method"
          value={draft.methodId}
          onChange={(e) => change({ methodId: e.target.value })}
          error={missing.methodId}
          disabled={busy}
        >
          <option value="">{methods.isPending ? 'Loading…' : 'Choose a method…'}</option>
          <MethodOptions methods={methods.data} />
        </SelectField>
        <SelectField
          label="Import profile (optional)"
          value={draft.profileId}
          onChange={(e) => change({ profileId: e.target.value })}
          disabled={busy}
          hint={
            profiles.error
              ? 'Profiles could not be loaded; the layout will be detected.'
              : 'Without a profile, delimiter, decimal separator, encoding and columns are detected.'
          }
        >
          <option value="">Detect the layout</option>
          {profiles.data?.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
      </div>
      <FileDropZone file={draft.file} onFile={(file) => change({ file })} disabled={busy} error={missing.file} />
      <div className="flex justify-end">
        <Button type="submit" disabled={busy}>
          Preview
        </Button>
      </div>
    </form>
  );
}
