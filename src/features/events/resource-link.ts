import { paths } from '../../config/paths.ts';
import type { FeedEvent } from './api/events.ts';

/** The console page of the resource an event is about, where there is one. */
export function resourceLink(event: FeedEvent): { to: string; label: string } | null {
  const id = typeof event.data.id === 'string' ? event.data.id : null;
  if (!id) return null;
  if (event.type.startsWith('sample.')) {
    const code = typeof event.data.code === 'string' ? event.data.code : id;
    return { to: paths.sample(id), label: `Sample ${code}` };
  }
  if (event.type === 'import.completed') return { to: paths.import(id), label: 'Import report' };
  return null;
}
