import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Field, FormError } from '../ui/Field';
import { authClient } from './client';

const schema = z
  .object({
    password: z.string().min(12, 'use at least 12 characters').max(128, 'use at most 128 characters'),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'the two passwords differ' });
type Values = z.infer<typeof schema>;

export default function ResetPasswordForm({ token, error: linkError }: { token: string | null; error: string | null }) {
  const [done, setDone] = useState(false);
  const [error, setError] = useState<string | null>(linkError === 'INVALID_TOKEN' ? 'This link is not valid or has expired. Ask for a new one.' : null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(schema) });
  if (!token)
    return (
      <div className="card space-y-3">
        <h1>Choose a new password</h1>
        <FormError message={error ?? 'This page needs the link from the password-reset e-mail.'} />
        <p className="text-sm"><a href="/forgot-password">Ask for a new link</a></p>
      </div>
    );
  if (done)
    return (
      <div className="card space-y-3" role="status">
        <h1>Password changed</h1>
        <p className="text-sm text-ink-700">Your new password is set and your other sessions were signed out.</p>
        <a className="btn-primary" href="/sign-in">Sign in</a>
      </div>
    );
  const onSubmit = handleSubmit(async ({ password }) => {
    setError(null);
    const { error: e } = await authClient.resetPassword({ newPassword: password, token });
    if (e) setError(e.message || 'Could not change the password. The link may have expired.');
    else setDone(true);
  });
  return (
    <form onSubmit={onSubmit} noValidate className="card space-y-4">
      <h1>Choose a new password</h1>
      <FormError message={error} />
      <Field label="New password" hint="At least 12 characters. A few unrelated words make a strong one." error={formState.errors.password?.message}>
        {({ id, describedBy, invalid }) => <input id={id} type="password" autoComplete="new-password" className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('password')} />}
      </Field>
      <Field label="New password again" error={formState.errors.confirm?.message}>
        {({ id, describedBy, invalid }) => <input id={id} type="password" autoComplete="new-password" className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('confirm')} />}
      </Field>
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>Set the password</button>
    </form>
  );
}
