// A nudge inside the process when a transaction that recorded events has committed, so the
// delivery worker fans out at once instead of at its next poll. Only a hint: the worker polls too
// (other nodes' events, events held back by the feed's horizon).
type Listener = () => void;

const listeners = new Set<Listener>();

export function onEventsCommitted(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function signalEventsCommitted(): void {
  for (const listener of listeners) listener();
}
