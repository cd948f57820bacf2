import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Field, FormError } from '../ui/Field';
import { authClient } from './client';

const schema = z.object({ email: z.email('enter the e-mail address of your account') });

export default function ForgotPasswordForm() {
  const [sent, setSent] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<{ email: string }>({ resolver: zodResolver(schema) });
  const onSubmit = handleSubmit(async ({ email }) => {
    setError(null);
    const { error: e } = await authClient.requestPasswordReset({ email, redirectTo: `${window.location.origin}/reset-password` });
    if (e && e.status !== 404) setError(e.status === 429 ? 'Too many requests. Wait a few minutes and try again.' : e.message || 'Could not send the message.');
    else setSent(true);
  });
  if (sent)
    return (
      <div className="card space-y-3" role="status">
        <h1>Check your mail</h1>
        <p className="text-sm text-ink-700">If an account exists for that address, a message with a link to choose a new password is on its way. The link works for one hour.</p>
        <p className="text-sm"><a href="/sign-in">Back to sign-in</a></p>
      </div>
    );
  return (
    <form onSubmit={onSubmit} noValidate className="card space-y-4">
      <h1>Reset your password</h1>
      <p className="text-sm text-ink-600">We will e-mail you a link to choose a new password.</p>
      <FormError message={error} />
      <Field label="E-mail" error={formState.errors.email?.message}>
        {({ id, describedBy, invalid }) => <input id={id} type="email" autoComplete="username" className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('email')} />}
      </Field>
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>Send the link</button>
      <p className="text-sm"><a href="/sign-in">Back to sign-in</a></p>
    </form>
  );
}
