/** A field's error text, tied to the field by id (aria-describedby). */
export function FieldError({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 text-sm font-semibold text-alarm-600">
      {message}
    </p>
  );
}

/**
 * The error's own message, or `fallback` when it is zod's generic type message
 * ("Invalid input: expected number, received NaN"), which says nothing to a person.
 */
export function plainMessage(error: { type?: unknown; message?: string } | undefined, fallback: string): string | undefined {
  if (!error) return undefined;
  const generic = ['invalid_type', 'invalid_value', 'invalid_union'].includes(String(error.type)) || /^Invalid/.test(error.message ?? '');
  return generic || !error.message ? fallback : error.message;
}

/** For number inputs: an empty box is "not given", anything else a number (NaN shows as a type error). */
export const numberOrUndefined = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));
