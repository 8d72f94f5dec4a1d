'use client';

/**
 * A group of big radio buttons (at least 44 px high) with a visible legend: one tap to choose,
 * arrow keys to move, like any radio group.
 */
export function ChoiceButtons<T extends string>({
  legend,
  name,
  options,
  value,
  onChange,
  hint,
}: {
  legend: string;
  name: string;
  options: readonly { value: T; label: string; detail?: string }[];
  value: T | undefined;
  onChange: (v: T) => void;
  hint?: React.ReactNode;
}) {
  return (
    <fieldset>
      <legend className="label">{legend}</legend>
      <div className="grid auto-cols-fr grid-flow-col gap-2">
        {options.map((o) => (
          <label
            key={o.value}
            className={`flex min-h-12 cursor-pointer flex-col items-center justify-center rounded-lg border-2 px-2 py-1 text-center font-semibold has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-flare-500 ${
              value === o.value ? 'border-hush-700 bg-hush-700 text-white' : 'border-ink/30 bg-white text-ink'
            }`}
          >
            <input type="radio" className="sr-only" name={name} value={o.value} checked={value === o.value} onChange={() => onChange(o.value)} />
            <span>{o.label}</span>
            {o.detail && <span className={`text-xs font-normal ${value === o.value ? 'text-white' : 'text-ink-soft'}`}>{o.detail}</span>}
          </label>
        ))}
      </div>
      {hint && <div className="mt-1 text-sm text-ink-soft">{hint}</div>}
    </fieldset>
  );
}
