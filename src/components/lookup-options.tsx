// The <option>s of an instrument or method select, labelled the same way on every page.
import type { Instrument, Method } from '../api/lookups.ts';

export function InstrumentOptions({ instruments }: { instruments: readonly Instrument[] | undefined }) {
  return instruments?.map((i) => (
    <option key={i.id} value={i.id}>
      {i.code} — {i.name}
    </option>
  ));
}

export function MethodOptions({ methods, label }: { methods: readonly Method[] | undefined; label?: (method: Method) => string }) {
  return methods?.map((m) => (
    <option key={m.id} value={m.id}>
      {label ? label(m) : `${m.code} — ${m.name}`}
    </option>
  ));
}
