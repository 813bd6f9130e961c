// The references a standardization mode takes ("slots": high and low for two-point, one otherwise),
// how references mapped from a file fill them, and where the server's errors on burn cells belong.
import type { ApiProblem } from '../../api/problem.ts';
import type { ReferenceMaterial } from '../../api/lookups.ts';
import type { CreateStandardizationRequest } from './api/standardizations.ts';
import { type BurnRow, emptyRows, sentRowIndexes } from './burns-grid.ts';
import type { MappedReference } from './file-mapping.ts';

export type Mode = CreateStandardizationRequest['mode'];
type Kind = ReferenceMaterial['kind'];

export const MODES: { value: Mode; label: string; slots: { label: string; kinds: Kind[] }[] }[] = [
  {
    value: 'two_point',
    label: 'Two-point (high and low reference)',
    slots: [
      { label: 'High reference', kinds: ['high'] },
      { label: 'Low reference', kinds: ['low'] },
    ],
  },
  { value: 'one_point_factor', label: 'One-point factor', slots: [{ label: 'Reference', kinds: ['high', 'low', 'type'] }] },
  { value: 'one_point_offset', label: 'One-point offset', slots: [{ label: 'Reference', kinds: ['high', 'low', 'type'] }] },
  { value: 'type', label: 'Type standardization (similar composition)', slots: [{ label: 'Reference', kinds: ['type'] }] },
];

export const slotsOf = (mode: Mode) => MODES.find((m) => m.value === mode)!.slots;

export interface Slot {
  referenceId: string;
  rows: BurnRow[];
}

export const emptySlots = (): Slot[] => [
  { referenceId: '', rows: emptyRows() },
  { referenceId: '', rows: emptyRows() },
];

/**
 * The mode the mapped references suggest (a high and a low: two-point; a lone type reference: type;
 * else the current one) and the slots filled from them; a slot no mapped reference fits is kept.
 */
export function fillSlots(
  mapped: readonly MappedReference[],
  kindOf: (referenceId: string) => Kind | undefined,
  mode: Mode,
  current: readonly Slot[],
): { mode: Mode; slots: Slot[] } {
  const kinds = mapped.map((m) => kindOf(m.referenceId));
  const next: Mode =
    kinds.includes('high') && kinds.includes('low') ? 'two_point' : mapped.length === 1 && kinds[0] === 'type' ? 'type' : mode;
  const targets = slotsOf(next);
  const used = new Set<string>();
  const slots = current.map((slot, i) => {
    const target = targets[i];
    const found = target && mapped.find((m) => !used.has(m.referenceId) && target.kinds.includes(kindOf(m.referenceId)!));
    if (!found) return slot;
    used.add(found.referenceId);
    return { referenceId: found.referenceId, rows: found.rows.length ? found.rows : emptyRows() };
  });
  return { mode: next, slots };
}

/** Server errors on burn cells ("body.measurements.0.burns.2.values.Mn") → "row|element" of each grid. */
export function cellErrorsOf(problem: ApiProblem | undefined, slots: readonly Slot[]): Map<string, string>[] {
  return slots.map((slot, i) => {
    const rows = sentRowIndexes(slot.rows);
    const errors = new Map<string, string>();
    for (const e of problem?.problem.errors ?? []) {
      const match = new RegExp(`^body\\.measurements\\.${i}\\.burns\\.(\\d+)\\.values\\.(\\w+)$`).exec(e.location);
      if (match && rows[Number(match[1])] !== undefined) errors.set(`${rows[Number(match[1])]}|${match[2]}`, e.message);
    }
    return errors;
  });
}
