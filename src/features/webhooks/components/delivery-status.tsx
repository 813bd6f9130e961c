// A delivery's state by icon and word, never by colour alone.
const LOOK: Record<string, { icon: string; word: string; className: string }> = {
  delivered: { icon: '✓', word: 'Delivered', className: 'text-verdigris-600' },
  failed: { icon: '✕', word: 'Failed', className: 'text-oxide-600' },
  pending: { icon: '◷', word: 'Pending', className: 'text-slag-700' },
};

export function DeliveryStatus({ status }: { status: string }) {
  const look = LOOK[status] ?? { icon: '?', word: status, className: 'text-slag-700' };
  return (
    <span className={`inline-flex items-center gap-1 text-sm font-medium ${look.className}`}>
      <span aria-hidden>{look.icon}</span>
      {look.word}
    </span>
  );
}
