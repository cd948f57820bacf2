import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Field, FormError } from '../ui/Field';
import { authClient } from './client';

const schema = z.object({
  email: z.email('enter the e-mail address of your account'),
  password: z.string().min(1, 'enter your password'),
});
type Values = z.infer<typeof schema>;

/** Only same-site paths are followed after sign-in (no open redirect). */
function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/start';
}

export default function SignInForm({ next, demoAccounts }: { next: string | null; demoAccounts: { email: string; role: string }[] }) {
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, setValue, formState } = useForm<Values>({ resolver: zodResolver(schema) });
  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    const { error: e } = await authClient.signIn.email({ email: values.email, password: values.password });
    if (e) {
      setError(
        e.status === 429
          ? e.message || 'Too many attempts. Wait a few minutes and try again.'
          : e.status === 401
            ? 'That e-mail and password do not match an account.'
            : e.message || 'Sign-in failed. Try again.',
      );
      return;
    }
    window.location.href = safeNext(next);
  });
  return (
    <div className="card space-y-5">
      <h1>Sign in</h1>
      <form onSubmit={onSubmit} noValidate className="space-y-4">
        <FormError message={error} />
        <Field label="E-mail" error={formState.errors.email?.message}>
          {({ id, describedBy, invalid }) => (
            <input id={id} type="email" autoComplete="username" className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('email')} />
          )}
        </Field>
        <Field label="Password" error={formState.errors.password?.message}>
          {({ id, describedBy, invalid }) => (
            <input id={id} type="password" autoComplete="current-password" className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('password')} />
          )}
        </Field>
        <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
        </button>
        <p className="text-sm">
          <a href="/forgot-password">Forgot your password?</a>
        </p>
      </form>
      {demoAccounts.length > 0 && (
        <section aria-labelledby="demo-heading" className="rounded-md border border-line-200 bg-line-50 p-4 text-sm">
          <h2 id="demo-heading" className="text-sm font-semibold text-line-800">
            Demo accounts
          </h2>
          <p className="mt-1 text-line-800">
            This install runs the invented demo region. Every account's password is <code className="figure">plumbline-demo-2026</code>.
          </p>
          <ul className="mt-2 space-y-1">
            {demoAccounts.map((a) => (
              <li key={a.email} className="flex items-center justify-between gap-2">
                <span>
                  <span className="figure">{a.email}</span> <span className="text-ink-500">— {a.role}</span>
                </span>
                <button
                  type="button"
                  className="text-line-700 underline"
                  onClick={() => {
                    setValue('email', a.email);
                    setValue('password', 'plumbline-demo-2026');
                  }}
                >
                  Use<span className="sr-only"> {a.email}</span>
                </button>
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
