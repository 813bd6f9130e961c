import { useEffect, useId, useRef, useState, type DragEvent } from 'react';
import { formatBytes } from '../../../lib/format-bytes.ts';

/**
 * A file input whose label is the drop zone: dropping a file, clicking the zone, or focusing the
 * input with Tab and pressing Enter or Space all choose the file. The input stays in the page
 * (visually hidden) so keyboards, screen readers and tests reach it as a normal file input.
 */
export function FileDropZone({
  file,
  onFile,
  disabled,
  error,
}: {
  file: File | null;
  onFile: (file: File | null) => void;
  disabled?: boolean;
  error?: string;
}) {
  const id = useId();
  const [dragging, setDragging] = useState(false);
  const input = useRef<HTMLInputElement>(null);
  // Starting over clears the input too, so choosing the same file again is noticed.
  useEffect(() => {
    if (!file && input.current) input.current.value = '';
  }, [file]);

  function drop(event: DragEvent<HTMLLabelElement>) {
    event.preventDefault();
    setDragging(false);
    if (disabled) return;
    const dropped = event.dataTransfer.files[0];
    if (dropped) onFile(dropped);
  }

  return (
    <div className="space-y-1">
      <input
        ref={input}
        id={id}
        type="file"
        className="peer sr-only"
        disabled={disabled}
        aria-describedby={error ? `${id}-error` : undefined}
        aria-invalid={error ? true : undefined}
        onChange={(event) => onFile(event.target.files?.[0] ?? null)}
      />
      <label
        htmlFor={id}
        onDragOver={(event) => {
          event.preventDefault();
          if (!disabled) setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={drop}
        data-testid="drop-zone"
        className={`flex min-h-36 cursor-pointer flex-col items-center justify-center gap-1 rounded-lg border-2 border-dashed px-6 py-8 text-center transition-colors peer-focus-visible:outline-2 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-ember-500 ${
          dragging
            ? 'border-ember-500 bg-ember-500/5'
            : error
              ? 'border-oxide-600 bg-white'
              : 'border-ash-200 bg-white hover:border-slag-300'
        } ${disabled ? 'cursor-not-allowed opacity-60' : ''}`}
      >
        <span className="text-sm font-medium text-slag-800">Result file</span>
        {file ? (
          <span className="text-sm">
            <span className="font-mono">{file.name}</span> <span className="text-slag-500">({formatBytes(file.size)})</span>
            <span className="block text-xs text-slag-500">Drop or choose another file to replace it.</span>
          </span>
        ) : (
          <span className="text-sm text-slag-500">
            Drop the file here, or click to choose it (Tab here, then Enter or Space). CSV or other delimited text.
          </span>
        )}
      </label>
      {error && (
        <p id={`${id}-error`} role="alert" className="text-xs font-medium text-oxide-600">
          ⚠ {error}
        </p>
      )}
    </div>
  );
}
