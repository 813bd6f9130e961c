// Step one of a run from the instrument's file: choose the result file (and, when the instrument
// writes an unusual layout, the import profile the sample import uses for it), read it, then say
// which reference material each sample of the file is. Codes that match are filled in; the others
// are chosen here (or left out, e.g. a production sample sparked in the same session).
import { useId, useState } from 'react';
import { type ImportProfile, type ReferenceMaterial } from '../../../api/lookups.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SelectField } from '../../../components/ui/field.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { type StandardizationFileReading, useReadStandardizationFile } from '../api/standardization-file.ts';
import { formatTime } from '../chart-data.ts';

/** Sample index in the file → reference material id ('' = left out). */
export type SampleMapping = string[];

export function FileReadingPanel({
  instrumentId,
  methodId,
  profiles,
  references,
  reading,
  mapping,
  onRead,
  onMapping,
}: {
  instrumentId: string;
  methodId: string;
  profiles: ImportProfile[];
  /** The references that can standardize the chosen method (its matrix, not controls). */
  references: ReferenceMaterial[];
  reading: StandardizationFileReading | null;
  mapping: SampleMapping;
  onRead: (reading: StandardizationFileReading) => void;
  onMapping: (mapping: SampleMapping) => void;
}) {
  const inputId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [profileId, setProfileId] = useState('');
  const read = useReadStandardizationFile();

  function submit() {
    if (!file) return;
    read.mutate({ instrumentId, methodId, profileId: profileId || undefined, file }, { onSuccess: onRead });
  }

  return (
    <fieldset className="min-w-0 space-y-3 rounded-lg border border-ash-200 bg-white p-4" data-testid="file-panel">
      <legend className="px-1 text-sm font-semibold text-slag-800">From the instrument’s file</legend>
      <p className="text-xs text-slag-500">
        The result file in which the reference materials were sparked, as the instrument wrote it. It is read like a sample import (same
        layouts and import profiles) and nothing is stored until you compute the corrections.
      </p>
      <div className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_auto]">
        <div className="space-y-1">
          <label htmlFor={inputId} className="block text-sm font-medium text-slag-800">
            Result file
          </label>
          <input
            id={inputId}
            type="file"
            accept=".csv,.txt,.tsv,text/csv,text/plain"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className="block w-full text-sm file:mr-3 file:rounded-md file:border file:border-ash-200 file:bg-white file:px-3 file:py-1.5 file:text-sm"
          />
        </div>
        <SelectField label="Import profile" value={profileId} onChange={(e) => setProfileId(e.target.value)}>
          <option value="">Detect the layout</option>
          {profiles.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
        <Button type="button" variant="secondary" disabled={!file || read.isPending} onClick={submit}>
          {read.isPending ? 'Reading…' : 'Read the file'}
        </Button>
      </div>
      <ProblemAlert error={read.error} />
      {reading && <FileSamples reading={reading} references={references} mapping={mapping} onMapping={onMapping} />}
    </fieldset>
  );
}

function FileSamples({
  reading,
  references,
  mapping,
  onMapping,
}: {
  reading: StandardizationFileReading;
  references: ReferenceMaterial[];
  mapping: SampleMapping;
  onMapping: (mapping: SampleMapping) => void;
}) {
  const notes = [
    ...(reading.elements_not_in_method.length
      ? [`Columns the method ${reading.method.code} does not measure are left out: ${reading.elements_not_in_method.join(', ')}.`]
      : []),
    ...(reading.missing_elements.length
      ? [`The file has no column for ${reading.missing_elements.join(', ')}: not corrected from this file unless typed below.`]
      : []),
    ...[...reading.warnings, ...reading.rejected].map((w) => (w.line ? `Line ${w.line}: ${w.message}` : w.message)),
  ];
  return (
    <div className="space-y-3">
      <p className="text-sm text-slag-800">
        <span className="font-mono">{reading.file.name}</span>: {reading.samples.length} sample{reading.samples.length === 1 ? '' : 's'}
        {reading.time_zone ? `, times read in ${reading.time_zone}` : ', no burn times in the file'}. Say which reference material each
        sample is.
      </p>
      {notes.length > 0 && (
        <Alert tone="caution" title="Read with remarks">
          <ul className="list-disc pl-5">
            {notes.map((note) => (
              <li key={note}>{note}</li>
            ))}
          </ul>
        </Alert>
      )}
      <Table head={['Sample in the file', 'Line', 'Burns', 'Measured', 'Reference material']} caption="Samples in the file">
        {reading.samples.map((sample, i) => (
          <tr key={`${sample.sample_code}-${sample.first_line}`} data-testid="file-sample">
            <th scope="row" className="px-3 py-1.5 text-left font-mono text-xs font-medium">
              {sample.sample_code}
            </th>
            <td className="px-3 py-1.5 text-right font-mono text-xs">{sample.first_line}</td>
            <td className="px-3 py-1.5 text-right font-mono text-xs">
              {sample.burns.length}
              {sample.rejected > 0 && <span className="text-oxide-600"> ({sample.rejected} unreadable)</span>}
            </td>
            <td className="px-3 py-1.5 font-mono text-xs">{sample.measured_at ? formatTime(sample.measured_at) : '—'}</td>
            <td className="px-3 py-1.5">
              <select
                aria-label={`Reference material for ${sample.sample_code}`}
                value={mapping[i] ?? ''}
                onChange={(e) => onMapping(mapping.map((id, j) => (j === i ? e.target.value : id)))}
                className="w-full min-w-48 rounded-md border border-ash-200 bg-white px-2 py-1 text-sm"
              >
                <option value="">Not a reference (leave out)</option>
                {references.map((r) => (
                  <option key={r.id} value={r.id}>
                    {r.code} ({r.kind})
                  </option>
                ))}
              </select>
              {sample.reference_material && mapping[i] === sample.reference_material.id && (
                <span className="mt-0.5 block text-xs text-slag-500">matched by its code</span>
              )}
            </td>
          </tr>
        ))}
      </Table>
    </div>
  );
}
