'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { inviteSchema, type InviteInput } from '@/lib/validation/users';
import { callApi } from '@/lib/api/client';
import type { Role } from '@/db/types';
import { TextField } from '@/components/ui/text-field';
import { NoticeBox } from '@/components/ui/notice-box';

export function InviteForm({ roles }: { roles: Role[] }) {
  const [message, setMessage] = useState<{ tone: 'info' | 'error'; text: string } | null>(null);
  const { register, handleSubmit, formState, reset } = useForm<InviteInput>({ resolver: zodResolver(inviteSchema), defaultValues: { role: 'member' } });
  async function onSubmit(values: InviteInput) {
    const r = await callApi<{ email: string }>('/api/invitations', { body: values });
    if (r.ok) {
      setMessage({ tone: 'info', text: `Invitation sent to ${r.data.email}.` });
      reset({ role: values.role, email: '', name: '' });
    } else setMessage({ tone: 'error', text: r.error });
  }
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate>
      {message && <NoticeBox tone={message.tone}>{message.text}</NoticeBox>}
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
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        Send invitation
      </button>
    </form>
  );
}
