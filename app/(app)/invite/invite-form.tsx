'use client';

import { useState } from 'react';
import { inviteSchema } from '@/lib/validation/users';
import { useApiForm } from '@/lib/api/use-api-form';
import type { Role } from '@/db/types';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';
import { FormProblemBox } from '@/components/ui/form-problem';

export function InviteForm({ roles }: { roles: Role[] }) {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { form, submit, problem, pending } = useApiForm<typeof inviteSchema, { email: string }>(inviteSchema, {
    defaultValues: { role: 'member', email: '', name: '' },
    request: () => ({ url: '/api/invitations' }),
    onSuccess: (data, values) => {
      setSentTo(data.email);
      form.reset({ role: values.role, email: '', name: '' });
    },
  });
  const { register, formState } = form;
  return (
    <form onSubmit={(e) => (setSentTo(null), submit(e))} className="card space-y-4" noValidate>
      {sentTo && <NoticeBox tone="info">Invitation sent to {sentTo}.</NoticeBox>}
      <FormProblemBox problem={problem} />
      <TextField id="name" label="Name" autoComplete="off" error={formState.errors.name} registration={register('name')} />
      <TextField id="email" label="E-mail" type="email" autoComplete="off" error={formState.errors.email} registration={register('email')} />
      <div>
        <label htmlFor="role" className="label">
          Role
        </label>
        <select id="role" className="field" {...register('role')}>
          {roles.map((r) => (
            <option key={r}>{r}</option>
          ))}
        </select>
      </div>
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        Send invitation
      </button>
    </form>
  );
}
