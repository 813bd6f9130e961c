import type { ReactNode } from 'react';
import { Card } from '../../../components/ui/layout.tsx';
import { useInstruments, useMethods, useSampleFields } from '../../../api/lookups.ts';
import { fieldLabels } from '../field-labels.ts';
import type { Sample } from '../api/samples.ts';
import { StatusBadge } from './status-badge.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-slag-500">{label}</dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </>
  );
}

export function SampleIdentity({ sample }: { sample: Sample }) {
  const instrument = useInstruments().data?.find((i) => i.id === sample.instrument.id);
  const method = useMethods().data?.find((m) => m.id === sample.method.id);
  const fields = fieldLabels(useSampleFields().data);
  return (
    <Card title="Identification">
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1.5 text-sm" data-testid="sample-identity">
        <Row label="Sample code">
          <span className="font-mono font-semibold">{sample.sample_code}</span>
        </Row>
        <Row label="Heat / lot">{sample.heat ? <span className="font-mono">{sample.heat}</span> : '—'}</Row>
        <Row label="Grade">{sample.grade ?? '—'}</Row>
        <Row label="Kind">{sample.kind ?? '—'}</Row>
        {fields.order(Object.keys(sample.fields)).map((key) => {
          const { label, description } = fields.labelOf(key);
          return (
            <Row key={key} label={label}>
              <span title={description ? `${description} (field ${key})` : `Field ${key}`} data-field={key}>
                {sample.fields[key]}
              </span>
            </Row>
          );
        })}
        <Row label="Instrument">
          <span className="font-mono">{sample.instrument.code}</span>
          {instrument && <span className="text-slag-500"> — {instrument.name}</span>}
        </Row>
        <Row label="Method">
          <span className="font-mono">{sample.method.code}</span>
          {method && <span className="text-slag-500"> — {method.name}</span>}
        </Row>
        <Row label="Status">
          <StatusBadge status={sample.status} />
        </Row>
        <Row label="Created">
          <Timestamp value={sample.created_at} seconds className="font-mono text-xs" /> by {sample.created_by}
        </Row>
        <Row label="Last change">
          <Timestamp value={sample.updated_at} seconds className="font-mono text-xs" />
        </Row>
      </dl>
    </Card>
  );
}
