import type { InputHTMLAttributes } from 'react';
import type { FieldError, UseFormRegisterReturn } from 'react-hook-form';

/** A labelled input with its error message tied to it for screen readers. */
export function TextField({
  id,
  label,
  error,
  registration,
  hint,
  ...rest
}: { id: string; label: string; error?: FieldError; registration: UseFormRegisterReturn; hint?: string } & InputHTMLAttributes<HTMLInputElement>) {
  const describedBy = [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <input id={id} className="field" aria-invalid={!!error} aria-describedby={describedBy} {...registration} {...rest} />
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-sm text-ink-soft">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="mt-1 text-sm font-semibold text-alarm-600">
          {error.message}
        </p>
      )}
    </div>
  );
}
