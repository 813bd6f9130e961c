import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

interface FieldProps {
  label: string;
  error?: string;
  hint?: ReactNode;
}

const CONTROL = 'w-full rounded-md border bg-white px-3 py-2 text-sm shadow-xs focus:border-ember-500 focus:outline-none';

function FieldFrame({ id, label, error, hint, children }: FieldProps & { id: string; children: ReactNode }) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-slag-800">
        {label}
      </label>
      {children}
      {hint && !error && <p className="text-xs text-slag-500">{hint}</p>}
      {error && (
        <p id={`${id}-error`} role="alert" className="text-xs font-medium text-oxide-600">
          ⚠ {error}
        </p>
      )}
    </div>
  );
}

export function TextField({ label, error, hint, ...input }: FieldProps & InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint}>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={`${CONTROL} ${error ? 'border-oxide-600' : 'border-ash-200'}`}
        {...input}
      />
    </FieldFrame>
  );
}

export function SelectField({ label, error, hint, children, ...select }: FieldProps & SelectHTMLAttributes<HTMLSelectElement>) {
  const id = useId();
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint}>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        className={`${CONTROL} ${error ? 'border-oxide-600' : 'border-ash-200'}`}
        {...select}
      >
        {children}
      </select>
    </FieldFrame>
  );
}

export function TextAreaField({ label, error, hint, ...textarea }: FieldProps & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const id = useId();
  return (
    <FieldFrame id={id} label={label} error={error} hint={hint}>
      <textarea
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={`${CONTROL} ${error ? 'border-oxide-600' : 'border-ash-200'}`}
        {...textarea}
      />
    </FieldFrame>
  );
}
