// Flags are told by an icon AND words, never by colour alone; the meaning is on hover and in the legend.
import { byTone, flagInfo, type FlagTone } from '../result-flags.ts';

// A problem is the strongest mark on the page (filled, bold); a check is outlined orange; a note is quiet grey.
const TONE: Record<FlagTone, { icon: string; className: string }> = {
  problem: { icon: '⚠', className: 'border-oxide-600 bg-oxide-600 font-semibold text-white' },
  check: { icon: '!', className: 'border-ember-500/40 bg-ember-500/10 font-medium text-ember-700' },
  note: { icon: 'ℹ', className: 'border-ash-200 bg-ash-50 font-normal text-slag-500' },
};

export function FlagBadge({ name }: { name: string }) {
  const info = flagInfo(name);
  const tone = TONE[info.tone];
  return (
    <span
      className={`inline-flex max-w-full items-center gap-1 rounded border px-1.5 py-0.5 text-xs ${tone.className}`}
      title={info.description ?? `Flag ${info.name}`}
      data-flag={info.name}
      data-tone={info.tone}
    >
      <span aria-hidden>{tone.icon}</span>
      {info.label}
    </span>
  );
}

export function FlagList({ flags, empty = '' }: { flags: string[]; empty?: string }) {
  if (flags.length === 0) return empty ? <span className="text-xs text-slag-500">{empty}</span> : null;
  const ordered = [...flags].sort(byTone);
  return (
    <span className="flex flex-wrap gap-1">
      {ordered.map((flag) => (
        <FlagBadge key={flag} name={flag} />
      ))}
    </span>
  );
}

/** What each flag present on the page means, in full. */
export function FlagLegend({ flags }: { flags: string[] }) {
  const unique = [...new Set(flags)].sort(byTone);
  if (unique.length === 0) return null;
  return (
    <section aria-labelledby="flag-legend" className="rounded-lg border border-ash-200 bg-white p-4">
      <h3 id="flag-legend" className="mb-2 text-sm font-semibold text-slag-800">
        What the flags mean
      </h3>
      <dl className="space-y-1.5 text-sm">
        {unique.map((name) => {
          const info = flagInfo(name);
          return (
            <div key={name} className="flex flex-wrap items-baseline gap-x-3 gap-y-0.5">
              <dt className="shrink-0">
                <FlagBadge name={name} />
              </dt>
              <dd className="min-w-60 flex-1 text-slag-700">
                {info.description ?? (
                  <>
                    Not described in this console version (flag <code>{name}</code>); see the API reference.
                  </>
                )}
              </dd>
            </div>
          );
        })}
      </dl>
    </section>
  );
}
