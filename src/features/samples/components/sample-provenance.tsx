import { Link } from 'react-router';
import { Card } from '../../../components/ui/layout.tsx';
import type { Sample } from '../api/samples.ts';
import { lineRanges } from '../figures.ts';
import { SampleCorrection } from './sample-correction.tsx';
import { paths } from '../../../config/paths.ts';

export function SampleProvenance({ sample }: { sample: Sample }) {
  const p = sample.provenance;
  return (
    <Card title="Provenance">
      {p.source === 'push' ? (
        <p className="text-sm">
          Pushed as JSON through the API by <strong>{sample.created_by}</strong>; there is no file.
        </p>
      ) : (
        <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1.5 text-sm" data-testid="sample-provenance">
          <dt className="text-slag-500">Source</dt>
          <dd>File import</dd>
          <dt className="text-slag-500">Import</dt>
          <dd>
            {p.import_id ? (
              <Link to={paths.import(p.import_id)} className="font-mono text-copper-700 underline">
                {p.import_id}
              </Link>
            ) : (
              '—'
            )}
          </dd>
          <dt className="text-slag-500">File</dt>
          <dd className="break-all">{p.file_name ?? '—'}</dd>
          <dt className="text-slag-500">SHA-256</dt>
          <dd className="break-all font-mono text-xs">{p.file_sha256 ?? '—'}</dd>
          <dt className="text-slag-500">File lines</dt>
          <dd className="font-mono text-xs">{p.lines.length ? lineRanges(p.lines) : '—'}</dd>
        </dl>
      )}
      <SampleCorrection correction={sample.correction} />
      {p.import_id && (
        <a
          href={`/api/v1/imports/${encodeURIComponent(p.import_id)}/file`}
          download
          className="mt-3 inline-block text-sm text-copper-700 underline"
        >
          ⤓ Download the raw file as uploaded
        </a>
      )}
    </Card>
  );
}
