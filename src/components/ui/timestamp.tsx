import { instantTitle, viewInstant } from '../../lib/timestamp.ts';

/**
 * An instant as the console shows it everywhere: local time with its zone ("2026-03-29 03:30 UTC+2"),
 * the UTC time and zone on hover, the ISO instant in the `dateTime` attribute. "—" without one.
 */
export function Timestamp({
  value,
  seconds = false,
  stacked = false,
  className = '',
}: {
  value: string | null | undefined;
  seconds?: boolean;
  /** Date above time, for narrow columns. */
  stacked?: boolean;
  className?: string;
}) {
  const view = viewInstant(value, { seconds });
  if (!view) return <span className={className}>—</span>;
  if (stacked)
    return (
      <time dateTime={view.iso} title={instantTitle(view)} className={`block whitespace-nowrap ${className}`}>
        <span className="block">{view.local.slice(0, 10)}</span>
        <span className="block text-slag-500">
          {view.local.slice(11)} {view.zone}
        </span>
      </time>
    );
  return (
    <time dateTime={view.iso} title={instantTitle(view)} className={`whitespace-nowrap ${className}`}>
      {view.local} <span className="text-slag-500">{view.zone}</span>
    </time>
  );
}
