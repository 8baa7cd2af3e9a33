'use client';

import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { signInSchema, type SignIn } from '@/lib/validations/auth';
import { api, ApiError } from '@/lib/api/client';
import { Field, Input } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';

export function SignInForm({ next }: { next: string }) {
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignIn>({ resolver: zodResolver(signInSchema) });

  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    try {
      await api('/api/auth/sign-in', { method: 'POST', json: values });
      window.location.assign(next);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'Sign-in failed.');
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Field label="Email" error={formState.errors.email?.message}>
        {(id) => <Input id={id} type="email" autoComplete="username" aria-invalid={!!formState.errors.email} {...register('email')} />}
      </Field>
      <Field label="Password" error={formState.errors.password?.message}>
        {(id) => <Input id={id} type="password" autoComplete="current-password" aria-invalid={!!formState.errors.password} {...register('password')} />}
      </Field>
      <Button type="submit" variant="primary" className="w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
