import type { CorrectionFlag } from '../api/standardizations.ts';

// A flag is told by its icon and its word, the colour only repeats it.
const FLAGS: Record<CorrectionFlag, { icon: string; label: string; style: string }> = {
  ok: { icon: '✓', label: 'OK', style: 'bg-verdigris-50 text-verdigris-600' },
  warn: { icon: '⚠', label: 'Warn', style: 'bg-ember-500/10 text-ember-700' },
  fail: { icon: '✕', label: 'Fail', style: 'bg-oxide-50 text-oxide-600' },
};

export function FlagBadge({ flag }: { flag: CorrectionFlag }) {
  const { icon, label, style } = FLAGS[flag];
  return (
    <span className={`inline-flex items-center gap-1 rounded px-1.5 py-0.5 text-xs font-semibold ${style}`} data-flag={flag}>
      <span aria-hidden>{icon}</span>
      {label}
    </span>
  );
}

export function StatusText({
  status,
  inForce,
  effectiveFrom,
}: {
  status: 'draft' | 'activated';
  inForce: boolean;
  effectiveFrom: string | null;
}) {
  if (inForce) return <span className="text-xs font-semibold text-verdigris-600">● In force</span>;
  if (status === 'draft') return <span className="text-xs text-slag-500">Draft</span>;
  const scheduled = effectiveFrom !== null && Date.parse(effectiveFrom) > Date.now();
  return <span className="text-xs text-slag-500">{scheduled ? 'Scheduled' : 'Superseded'}</span>;
}
