import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ClippedText } from '../../../components/ui/clipped-text.tsx';
import { Alert } from '../../../components/ui/feedback.tsx';
import { Badge, Table } from '../../../components/ui/layout.tsx';
import type { ImportPreview } from '../api/imports.ts';
import { isColumnReviewWarning } from '../column-decisions.ts';
import { decidedBy, elementsOf, readingInWords, roleInWords } from '../column-roles.ts';
import { IssuesSection } from './import-issues-table.tsx';
import { LayoutSummary } from './layout-summary.tsx';
import { paths } from '../../../config/paths.ts';

/** Samples whose burns the preview shows (the server sends up to 20). */
const SHOWN_SAMPLES = 5;

const right = (text: string) => (
  <span key={text} className="block text-right">
    {text}
  </span>
);

/** How the server reads the file: every column's reading, the first samples' burns, and what it found wrong. */
export function ImportPreviewView({ preview, decisions }: { preview: ImportPreview; decisions?: ReactNode }) {
  const shown = preview.samples.slice(0, SHOWN_SAMPLES);
  const burns = shown.flatMap((sample) => sample.burns.map((burn) => ({ sample, burn })));
  const elements = elementsOf(
    preview.layout.columns,
    burns.map((b) => b.burn.values),
  );
  const flaggedElements = new Set(preview.layout.columns.flatMap((c) => (c.attention && c.element ? [c.element] : [])));
  // The columns to decide are shown above, with their choices: their warnings are not repeated.
  const otherWarnings = preview.warnings.filter((w) => !isColumnReviewWarning(w));
  return (
    <div className="space-y-5" data-testid="import-preview">
      {preview.duplicate_of && (
        <Alert tone="info" title="These bytes were imported before">
          An earlier upload holds exactly this file:{' '}
          <Link to={paths.import(preview.duplicate_of)} className="font-mono text-copper-700 underline">
            {preview.duplicate_of}
          </Link>
          . Importing it again creates nothing and shows that import&apos;s report.
        </Alert>
      )}
      <LayoutSummary
        layout={preview.layout}
        counts={[
          ['Data rows', preview.counts.rows],
          ['Samples', preview.counts.samples],
          ['Burns', preview.counts.burns],
          ['Values', preview.counts.values],
        ]}
      />
      {decisions}

      <section className="space-y-2">
        <h3 className="text-sm font-semibold text-slag-800">How each column will be read</h3>
        <Table caption="How each column of the file is read" head={['Header', 'Read as', 'Stored as', 'Decided by']}>
          {preview.layout.columns.map((c, i) => (
            <tr
              key={`${c.header}-${i}`}
              data-testid="column-row"
              data-attention={c.attention?.code}
              className={c.attention ? 'bg-ember-500/5' : undefined}
            >
              <td className="px-3 py-1.5 font-mono text-xs">
                {c.header ? <ClippedText text={c.header} /> : <span className="text-slag-500">(empty)</span>}
              </td>
              <td className="px-3 py-1.5">{roleInWords(c.role)}</td>
              <td className="px-3 py-1.5">{readingInWords(c)}</td>
              <td className="px-3 py-1.5 text-xs text-slag-700">
                {c.attention ? <Badge tone="accent">⚠ Needs a decision</Badge> : decidedBy(c)}
              </td>
            </tr>
          ))}
        </Table>
      </section>

      <section className="space-y-2">
        <h3 className="text-sm font-semibold text-slag-800">
          First samples{' '}
          <span className="font-normal text-slag-500">
            ({shown.length} of {preview.counts.samples}; values as written in the file)
          </span>
        </h3>
        {burns.length === 0 ? (
          <p className="text-sm text-slag-500">No readable sample in this file.</p>
        ) : (
          <Table
            caption="The first samples' burns as they would be stored"
            head={[
              right('Line'),
              'Sample code',
              'Heat',
              right('Burn'),
              'Time',
              ...elements.map((el) => (
                <span
                  key={el}
                  className="block text-right normal-case"
                  title={flaggedElements.has(el) ? 'This column needs a decision' : undefined}
                >
                  {flaggedElements.has(el) && <span aria-label="needs a decision">⚠ </span>}
                  {el}
                </span>
              )),
            ]}
          >
            {burns.map(({ sample, burn }) => (
              <tr key={`${sample.first_line}-${burn.line}`} data-testid="preview-burn-row">
                <td className="px-3 py-1.5 text-right font-mono text-xs tabular-nums">{burn.line}</td>
                <td className="px-3 py-1.5 font-mono text-xs">
                  <ClippedText text={sample.sample_code} />
                </td>
                <td className="px-3 py-1.5 font-mono text-xs">{sample.heat ? <ClippedText text={sample.heat} /> : '—'}</td>
                <td className="px-3 py-1.5 text-right font-mono text-xs tabular-nums">{burn.burn_number}</td>
                <td className="px-3 py-1.5 whitespace-nowrap font-mono text-xs">{burn.measured_at ?? '—'}</td>
                {elements.map((el) => (
                  <td key={el} className="px-3 py-1.5 text-right font-mono text-xs tabular-nums">
                    <ClippedText text={burn.values[el] ?? ''} />
                  </td>
                ))}
              </tr>
            ))}
          </Table>
        )}
      </section>

      <IssuesSection title="Lines that cannot be read" issues={preview.rejected} testId="preview-rejected" />
      <IssuesSection title="Warnings" issues={otherWarnings} testId="preview-warnings" />
    </div>
  );
}
