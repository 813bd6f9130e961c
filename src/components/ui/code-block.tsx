import { useState } from 'react';

/** Copy-paste text (commands, JSON) in the mono face, with a copy button. */
export function CodeBlock({ code, label, testId }: { code: string; label?: string; testId?: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <figure className="overflow-hidden rounded-md border border-slag-800 bg-slag-900">
      <figcaption className="flex items-center justify-between border-b border-slag-800 px-3 py-1.5 text-xs text-slag-300">
        <span>{label}</span>
        <button
          type="button"
          className="rounded px-2 py-0.5 text-ash-100 hover:bg-slag-800"
          onClick={() => {
            void navigator.clipboard?.writeText(code).then(() => {
              setCopied(true);
              setTimeout(() => setCopied(false), 1500);
            });
          }}
        >
          {copied ? '✓ Copied' : 'Copy'}
        </button>
      </figcaption>
      <pre data-testid={testId} className="overflow-x-auto p-3 text-xs leading-relaxed text-ash-100">
        {code}
      </pre>
    </figure>
  );
}
