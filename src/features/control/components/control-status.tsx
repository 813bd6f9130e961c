// A control status as icon and word: in control, violation (instrument in verify), provisional.
export type ControlState = 'in_control' | 'verify' | 'provisional';

const STATES: Record<ControlState, { icon: string; word: string; className: string }> = {
  in_control: { icon: '✓', word: 'In control', className: 'bg-verdigris-50 text-verdigris-600' },
  verify: { icon: '⚠', word: 'Violation — verify', className: 'bg-oxide-50 text-oxide-600' },
  provisional: { icon: '◌', word: 'Provisional', className: 'bg-ash-100 text-slag-700' },
};

export function ControlStatus({ state }: { state: ControlState }) {
  const s = STATES[state];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded px-1.5 py-0.5 text-xs font-medium ${s.className}`}
      data-testid="control-status"
    >
      <span aria-hidden>{s.icon}</span>
      {s.word}
    </span>
  );
}
