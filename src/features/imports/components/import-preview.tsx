import { Link } from 'react-router';
import { Alert } from '../../../components/ui/feedback.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import type { ImportPreview } from '../api/imports.ts';
import { elementsOf, roleInWords } from '../column-roles.ts';
import { IssuesSection } from './import-issues-table.tsx';
import { LayoutSummary } from './layout-summary.tsx';
import { paths } from '../../../config/paths.ts';

/** Samples whose burns the preview shows (the server sends up to 20). */
const SHOWN_SAMPLES = 5;

export function ImportPreviewView({ preview }: { preview: ImportPreview }) {
  const shown = preview.samples.slice(0, SHOWN_SAMPLES);
  const burns = shown.flatMap((sample) => sample.burns.map((burn) => ({ sample, burn })));
  const elements = elementsOf(
    preview.layout.columns,
    burns.map((b) => b.burn.values),
  );
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

      <section className="space-y-2">
        <h3 className="text-sm font-semibold text-slag-800">Recognised columns</h3>
        <Table caption="How each column of the file is read" head={['Header', 'Read as', 'Element', 'Unit']}>
          {preview.layout.columns.map((c, i) => (
            <tr key={`${c.header}-${i}`} data-testid="column-row">
              <td className="px-3 py-1.5 font-mono text-xs">{c.header || <span className="text-slag-500">(empty)</span>}</td>
              <td className="px-3 py-1.5">{roleInWords(c.role)}</td>
              <td className="px-3 py-1.5 font-mono">{c.element ?? ''}</td>
              <td className="px-3 py-1.5 font-mono">{c.unit ?? ''}</td>
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
              'Line',
              'Sample code',
              'Heat',
              'Burn',
              'Time',
              ...elements.map((el) => (
                <span key={el} className="block text-right normal-case">
                  {el}
                </span>
              )),
            ]}
          >
            {burns.map(({ sample, burn }) => (
              <tr key={`${sample.first_line}-${burn.line}`} data-testid="preview-burn-row">
                <td className="px-3 py-1.5 text-right font-mono text-xs">{burn.line}</td>
                <td className="px-3 py-1.5 font-mono text-xs">{sample.sample_code}</td>
                <td className="px-3 py-1.5 font-mono text-xs">{sample.heat ?? '—'}</td>
                <td className="px-3 py-1.5 text-right font-mono text-xs">{burn.burn_number}</td>
                <td className="px-3 py-1.5 whitespace-nowrap font-mono text-xs">{burn.measured_at ?? '—'}</td>
                {elements.map((el) => (
                  <td key={el} className="px-3 py-1.5 text-right font-mono text-xs tabular-nums">
                    {burn.values[el] ?? ''}
                  </td>
                ))}
              </tr>
            ))}
          </Table>
        )}
      </section>

      <IssuesSection title="Rejected lines" issues={preview.rejected} testId="preview-rejected" />
      <IssuesSection title="Warnings" issues={preview.warnings} testId="preview-warnings" />
    </div>
  );
}
