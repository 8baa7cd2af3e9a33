'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { minPasswordLength, passwordChangeFormSchema, type PasswordChangeForm } from '@/lib/validations/auth';
import { api, ApiError } from '@/lib/api/client';
import { Field, Input } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';

const fields = ['currentPassword', 'newPassword'] as const;

/** Changes the signed-in account's password; the account's other sessions are signed out. */
export function PasswordForm() {
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const { register, handleSubmit, formState, reset, setError: setFieldError } = useForm<PasswordChangeForm>({
    resolver: zodResolver(passwordChangeFormSchema),
    defaultValues: { currentPassword: '', newPassword: '', repeatPassword: '' },
  });

  const onSubmit = handleSubmit(async ({ currentPassword, newPassword }) => {
    setError(null);
    setDone(null);
    try {
      const res = await api<{ endedSessions: number }>('/api/auth/password', { method: 'POST', json: { currentPassword, newPassword } });
      reset();
      const others = res.endedSessions === 1 ? '1 other session was' : `${res.endedSessions} other sessions were`;
      setDone(`Password changed. ${others} signed out; this one stays signed in.`);
    } catch (err) {
      if (!(err instanceof ApiError)) return setError('The password could not be changed.');
      let placed = false;
      for (const f of fields) {
        const message = err.fieldErrors[f]?.[0];
        if (message) {
          setFieldError(f, { message });
          placed = true;
        }
      }
      if (!placed) setError(err.message);
    }
  });

  const { errors } = formState;
  return (
    <form onSubmit={onSubmit} className="max-w-sm space-y-4" noValidate>
      {error ? <Notice tone="error">{error}</Notice> : null}
      {done ? <Notice>{done}</Notice> : null}
      <Field label="Current password" error={errors.currentPassword?.message}>
        {(id) => <Input id={id} type="password" autoComplete="current-password" aria-invalid={!!errors.currentPassword} {...register('currentPassword')} />}
      </Field>
      <Field label="New password" error={errors.newPassword?.message} hint={`At least ${minPasswordLength} characters.`}>
        {(id) => <Input id={id} type="password" autoComplete="new-password" aria-invalid={!!errors.newPassword} {...register('newPassword')} />}
      </Field>
      <Field label="New password again" error={errors.repeatPassword?.message}>
        {(id) => <Input id={id} type="password" autoComplete="new-password" aria-invalid={!!errors.repeatPassword} {...register('repeatPassword')} />}
      </Field>
      <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Changing…' : 'Change password'}
      </Button>
      <p className="text-xs text-ink-faint">Every other browser signed in to this account is signed out when the password changes.</p>
    </form>
  );
}
