// What an import will do to the lab's data, in words, for the mode chosen: the sentence above
// the import button and the button's own label.
import type { ImportMode, ImportPreview } from './api/imports.ts';

export interface ImportPlan {
  /** False when the import would store nothing (the button is then disabled). */
  canProceed: boolean;
  title: string;
  text: string;
  button: string;
}

const count = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString('en')} ${n === 1 ? one : many}`;

const REVIEW =
  'They are stored as drafts with the raw file: no result is released until someone reviews and releases it, and the report lists every warning.';

export function importPlan(preview: ImportPreview, mode: ImportMode): ImportPlan {
  if (preview.duplicate_of) {
    return {
      canProceed: true,
      title: 'Nothing new will be stored',
      text: 'This exact file was imported before. Going on shows that import and its report; no sample is added twice.',
      button: 'Show the earlier import',
    };
  }
  const { samples, samples_with_rejected_lines: broken } = preview.counts;
  const lines = new Set(preview.rejected.map((issue) => issue.line)).size;
  const readable = samples - broken;
  if (lines > 0 && mode === 'all_or_nothing') {
    return {
      canProceed: false,
      title: 'This file would be refused whole',
      text: `${count(lines, 'line')} cannot be read, and this choice stores the file only when every line can. Correct the file and upload it again, or choose “Sample by sample” to store the ${count(readable, 'sample')} whose lines can all be read.`,
      button: 'Import the whole file',
    };
  }
  if (readable === 0) {
    return {
      canProceed: false,
      title: 'No sample can be stored',
      text: 'Every sample of this file has a line that cannot be read. Correct the file and upload it again.',
      button: 'Import',
    };
  }
  if (lines > 0) {
    const leftOut = lines === 1 ? 'The line that cannot be read is' : `The ${lines} lines that cannot be read are`;
    const alsoSamples = broken > 0 ? `, with the ${count(broken, 'sample')} they belong to,` : '';
    return {
      canProceed: true,
      title: `${count(readable, 'sample')} will be stored, ${broken > 0 ? count(broken, 'sample') : count(lines, 'line')} left out`,
      text: `${count(readable, 'sample')} will be added to the lab's results. ${leftOut}${alsoSamples} left out and listed in the report. ${REVIEW}`,
      button: `Import ${count(readable, 'sample')}, leave out ${broken > 0 ? count(broken, 'sample') : count(lines, 'line')}`,
    };
  }
  return {
    canProceed: true,
    title: `${count(readable, 'sample')} will be stored`,
    text: `${count(readable, 'sample')} (${count(preview.counts.burns, 'burn')}, ${count(preview.counts.values, 'value')}) will be added to the lab's results. ${REVIEW}`,
    button: `Import ${count(readable, 'sample')}`,
  };
}
