// Upload in three steps: choose (instrument, method, profile, file) → preview (how the server
// reads it; nothing stored) → import (with upload progress) → the import report.
import { useState, type ReactNode } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Alert } from '../../../components/ui/feedback.tsx';
import { useCommitImport, usePreviewImport, type ImportMode, type UploadChoice } from '../api/imports.ts';
import { useImportProfiles, type ImportProfile } from '../../../api/lookups.ts';
import { ColumnDecisionsPanel } from './column-decisions-panel.tsx';
import { CommitPanel } from './commit-panel.tsx';
import { ImportPreviewView } from './import-preview.tsx';
import { ImportProblem } from './import-problem.tsx';
import type { FlagLabel } from './flag-summary.tsx';
import { ImportReportView } from './import-report.tsx';
import { EMPTY_DRAFT, UploadChoicesForm, type UploadDraft } from './upload-choices-form.tsx';
import { UploadProgressBar } from './upload-progress.tsx';

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

function choiceOf(draft: UploadDraft): UploadChoice {
  return {
    file: draft.file as File,
    instrumentId: draft.instrumentId,
    methodId: draft.methodId,
    ...(draft.profileId ? { profileId: draft.profileId } : {}),
  };
}

/** `createdSamples` renders the samples an import created (the page composes it from the samples feature). */
export function UploadWizard({ createdSamples, flagLabel }: { createdSamples: (importId: string) => ReactNode; flagLabel?: FlagLabel }) {
  const [draft, setDraft] = useState<UploadDraft>(EMPTY_DRAFT);
  const [mode, setMode] = useState<ImportMode>('all_or_nothing');
  const preview = usePreviewImport();
  const profiles = useImportProfiles();
  const commit = useCommitImport();

  function changeDraft(next: UploadDraft) {
    setDraft(next);
    preview.reset();
    commit.reset();
  }

  /** The decisions were saved into `profile`: read the file again with it. */
  function previewWith(profile: ImportProfile) {
    const next = { ...draft, profileId: profile.id };
    changeDraft(next);
    preview.mutate(choiceOf(next));
  }

  function restart() {
    changeDraft(EMPTY_DRAFT);
    setMode('all_or_nothing');
  }

  if (commit.data) {
    const record = commit.data.data;
    const created = commit.data.status === 201;
    return (
      <div className="space-y-5">
        {created ? (
          <Alert
            tone="success"
            title={`Imported: ${plural(record.report.counts.samples_created, 'sample')} created from ${record.file.name}`}
          >
            The report below is kept with the import, together with the raw file.
          </Alert>
        ) : (
          <Alert tone="info" title="These bytes were imported before: nothing new was created">
            This is the report of the earlier import of the same file.
          </Alert>
        )}
        <ImportReportView record={record} flagLabel={flagLabel} />
        {record.report.counts.samples_created > 0 && (
          <section className="space-y-2">
            <h2 className="text-lg font-semibold">Samples of this import</h2>
            {createdSamples(record.id)}
          </section>
        )}
        <Button variant="secondary" onClick={restart}>
          Upload another file
        </Button>
      </div>
    );
  }

  const busy = preview.isPending || commit.isPending;
  return (
    <div className="space-y-5">
      <UploadChoicesForm draft={draft} onChange={changeDraft} onPreview={() => preview.mutate(choiceOf(draft))} busy={busy} />
      {preview.isPending && (
        <UploadProgressBar progress={preview.progress} sending="Sending the file for a preview" working="Reading the file…" />
      )}
      <ImportProblem error={preview.error} fileSize={draft.file?.size} during="preview" />
      {preview.data && (
        <>
          <ImportPreviewView
            preview={preview.data}
            decisions={
              <ColumnDecisionsPanel
                // A new preview (after saving) starts the choices afresh.
                key={preview.submittedAt}
                preview={preview.data}
                profile={profiles.data?.find((p) => p.id === draft.profileId)}
                fileName={draft.file?.name ?? 'the file'}
                onSaved={previewWith}
              />
            }
          />
          <CommitPanel
            preview={preview.data}
            mode={mode}
            onMode={setMode}
            onCommit={() => commit.mutate({ ...choiceOf(draft), mode })}
            onRestart={restart}
            busy={busy}
          />
          {commit.isPending && (
            <UploadProgressBar progress={commit.progress} sending="Uploading" working="Storing the samples and computing results…" />
          )}
          <ImportProblem error={commit.error} fileSize={draft.file?.size} during="import" />
        </>
      )}
    </div>
  );
}
