import type { InputHTMLAttributes, SelectHTMLAttributes } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { FieldError } from '@/components/ui/field-error';

type Common = { id: string; label: React.ReactNode; error?: string; hint?: React.ReactNode; hideLabel?: boolean; className?: string };

const describedBy = (id: string, hint: unknown, error: unknown) => [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;

/** Label, control, hint and error around any input, wired together for screen readers. */
function Frame({ id, label, error, hint, hideLabel, className, children }: Common & { children: React.ReactNode }) {
  return (
    <div className={className}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'label'}>
        {label}
      </label>
      {children}
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-sm text-ink-soft">
          {hint}
        </p>
      )}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

/** A number box (decimal keypad on phones); `registration` should turn '' into undefined or null. */
export function NumberField({ registration, ...p }: Common & { registration: UseFormRegisterReturn } & Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'className'>) {
  const { id, label, error, hint, hideLabel, className, ...input } = p;
  return (
    <Frame {...{ id, label, error, hint, hideLabel, className }}>
      <input
        id={id}
        type="number"
        inputMode="decimal"
        step="any"
        className="field"
        aria-invalid={!!error}
        aria-describedby={describedBy(id, hint, error)}
        {...input}
        {...registration}
      />
    </Frame>
  );
}

/** A select with a first "choose" option when `placeholder` is given. */
export function SelectField({
  registration,
  options,
  placeholder,
  ...p
}: Common & { registration: UseFormRegisterReturn; options: { value: string | number; label: string }[]; placeholder?: string } & Omit<
    SelectHTMLAttributes<HTMLSelectElement>,
    'id' | 'className'
  >) {
  const { id, label, error, hint, hideLabel, className, ...select } = p;
  return (
    <Frame {...{ id, label, error, hint, hideLabel, className }}>
      <select id={id} className="field" aria-invalid={!!error} aria-describedby={describedBy(id, hint, error)} {...select} {...registration}>
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Frame>
  );
}

/** A labelled multi-line text box with its error tied to it. */
export function TextAreaField({ registration, rows = 2, ...p }: Common & { registration: UseFormRegisterReturn; rows?: number; placeholder?: string }) {
  const { id, label, error, hint, hideLabel, className, placeholder } = p;
  return (
    <Frame {...{ id, label, error, hint, hideLabel, className }}>
      <textarea id={id} rows={rows} className="field" placeholder={placeholder} aria-invalid={!!error} aria-describedby={describedBy(id, hint, error)} {...registration} />
    </Frame>
  );
}

/** A radio or checkbox as a large tappable chip (≥ 44 px) that shows when it is chosen. */
export function ChoiceChip({ children, className = '', ...input }: { children: React.ReactNode; className?: string } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label
      className={`flex min-h-11 cursor-pointer items-center gap-3 rounded-lg border border-ink/20 bg-white px-3 py-2 has-[:checked]:border-hush-700 has-[:checked]:bg-hush-50 ${className}`}
    >
      <input type="radio" className="h-5 w-5 shrink-0 accent-hush-700" {...input} />
      {children}
    </label>
  );
}
