import type { FieldError, UseFormRegisterReturn } from 'react-hook-form';
import { TextField } from './text-field';

/** The new password and its repetition, as every form that sets a password asks for them. */
export function NewPasswordFields(p: {
  password: UseFormRegisterReturn;
  confirm: UseFormRegisterReturn;
  errors: { password?: FieldError; confirm?: FieldError };
}) {
  return (
    <>
      <TextField
        id="password"
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A short sentence is easy to remember."
        error={p.errors.password}
        registration={p.password}
      />
      <TextField id="confirm" label="The same again" type="password" autoComplete="new-password" error={p.errors.confirm} registration={p.confirm} />
    </>
  );
}
