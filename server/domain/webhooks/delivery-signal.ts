// A nudge inside the process when deliveries were queued by hand (test event, retry, recover), so
// the worker sends them at once instead of at its next poll.
type Listener = () => void;

const listeners = new Set<Listener>();

export function onDeliveriesQueued(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function signalDeliveriesQueued(): void {
  for (const listener of listeners) listener();
}
