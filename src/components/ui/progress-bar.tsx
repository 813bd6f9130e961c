/** A labelled progress bar; without `value` it says the work goes on without a measure. */
export function ProgressBar({ label, value, detail }: { label: string; value?: number; detail?: string }) {
  const percent = value === undefined ? undefined : Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div className="space-y-1">
      <div className="flex justify-between gap-4 text-sm">
        <span className="font-medium text-slag-800">{label}</span>
        <span className="font-mono text-xs text-slag-500">{detail ?? (percent === undefined ? '' : `${percent} %`)}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        aria-valuetext={percent === undefined ? 'in progress' : `${percent} %`}
        className="h-2.5 overflow-hidden rounded-full bg-ash-200"
      >
        <div
          className={`h-full rounded-full bg-ember-500 transition-[width] ${percent === undefined ? 'w-1/3 animate-pulse' : ''}`}
          style={percent === undefined ? undefined : { width: `${percent}%` }}
        />
      </div>
    </div>
  );
}
