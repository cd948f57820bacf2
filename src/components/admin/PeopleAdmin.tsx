/** Accounts: create, change role and installations, block or unblock. */
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { ROLES, ROLE_LABELS, type Role } from '../../lib/domain';
import { userInputSchema } from '../../lib/schemas/users';
import { api } from '../ui/api';
import { showApiError } from '../ui/forms';
import { Field, FormError } from '../ui/Field';
import { QueryProvider } from '../ui/query';

interface UserRow {
  id: string;
  email: string;
  name: string;
  role: Role | null;
  banned: boolean;
  installations: string[];
}

const SCOPED: Role[] = ['installation_staff', 'auditor'];

function NewPerson({ installations }: { installations: string[] }) {
  const qc = useQueryClient();
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  type Values = z.input<typeof userInputSchema>;
  const { register, handleSubmit, watch, reset, setError: setFieldError, formState } = useForm<Values>({
    resolver: zodResolver(userInputSchema) as never,
    defaultValues: { role: 'installation_staff', installations: [] },
  });
  const role = watch('role');
  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    setDone(null);
    try {
      await api('/api/users', { method: 'POST', body: values });
      setDone(`Account created. ${values.email} has been sent a link to choose a password.`);
      reset({ role: values.role, installations: [] });
      await qc.invalidateQueries({ queryKey: ['users'] });
    } catch (e) {
      showApiError(e, setFieldError, setError);
    }
  });
  const msg = (x: { message?: unknown } | undefined) => (typeof x?.message === 'string' ? x.message : undefined);
  return (
    <form onSubmit={onSubmit} noValidate className="card space-y-4" aria-labelledby="new-person">
      <h2 id="new-person">New account</h2>
      <FormError message={error} />
      {done && <p className="notice-info" role="status">{done}</p>}
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Name" required error={msg(formState.errors.name)}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('name')} />}
        </Field>
        <Field label="E-mail" required error={msg(formState.errors.email)}>
          {({ id, describedBy, invalid }) => <input id={id} type="email" className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('email')} />}
        </Field>
        <Field label="Role" required error={msg(formState.errors.role)}>
          {({ id, describedBy, invalid }) => (
            <select id={id} className="field-input" aria-describedby={describedBy} aria-invalid={invalid} {...register('role')}>
              {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
            </select>
          )}
        </Field>
      </div>
      {SCOPED.includes(role as Role) && (
        <fieldset>
          <legend className="field-label">Installations this person works on</legend>
          <div className="flex flex-wrap gap-3">
            {installations.map((c) => (
              <label key={c} className="flex items-center gap-1.5 text-sm">
                <input type="checkbox" value={c} {...register('installations')} /> <span className="figure">{c}</span>
              </label>
            ))}
          </div>
        </fieldset>
      )}
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>Create account</button>
    </form>
  );
}

function PersonRow({ user, installations, selfId }: { user: UserRow; installations: string[]; selfId: string }) {
  const qc = useQueryClient();
  const [editing, setEditing] = useState(false);
  const [role, setRole] = useState<Role>(user.role ?? 'auditor');
  const [assigned, setAssigned] = useState<string[]>(user.installations);
  const save = useMutation({
    mutationFn: (body: Record<string, unknown>) => api(`/api/users/${user.id}`, { method: 'PATCH', body }),
    onSuccess: async () => {
      setEditing(false);
      await qc.invalidateQueries({ queryKey: ['users'] });
    },
  });
  return (
    <tr>
      <td>
        <span className="block font-medium">{user.name}</span>
        <span className="figure text-xs text-ink-500">{user.email}</span>
      </td>
      <td>
        {editing ? (
          <select aria-label={`Role of ${user.name}`} className="field-input" value={role} onChange={(e) => setRole(e.target.value as Role)}>
            {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
          </select>
        ) : user.role ? ROLE_LABELS[user.role] : '—'}
      </td>
      <td>
        {editing && SCOPED.includes(role) ? (
          <fieldset className="flex flex-wrap gap-2">
            <legend className="sr-only">Installations of {user.name}</legend>
            {installations.map((c) => (
              <label key={c} className="flex items-center gap-1 text-xs">
                <input type="checkbox" checked={assigned.includes(c)} onChange={(e) => setAssigned(e.target.checked ? [...assigned, c] : assigned.filter((x) => x !== c))} />
                <span className="figure">{c}</span>
              </label>
            ))}
          </fieldset>
        ) : SCOPED.includes(user.role as Role) ? (
          <span className="figure">{user.installations.join(', ') || 'none assigned'}</span>
        ) : (
          <span className="text-ink-500">all</span>
        )}
      </td>
      <td>{user.banned ? <span className="badge bg-brick-soft text-brick-ink">blocked</span> : <span className="badge bg-line-50 text-line-800">active</span>}</td>
      <td className="whitespace-nowrap">
        {save.error && <p className="field-error" role="alert">{(save.error as Error).message}</p>}
        {editing ? (
          <div className="flex gap-2">
            <button type="button" className="btn-primary" disabled={save.isPending} onClick={() => save.mutate({ role, installations: SCOPED.includes(role) ? assigned : [] })}>Save</button>
            <button type="button" className="btn-secondary" onClick={() => setEditing(false)}>Cancel</button>
          </div>
        ) : (
          <div className="flex gap-2">
            <button type="button" className="btn-secondary" onClick={() => setEditing(true)}>Change<span className="sr-only"> {user.name}</span></button>
            {user.id !== selfId && (
              <button type="button" className="btn-secondary" disabled={save.isPending} onClick={() => save.mutate({ banned: !user.banned })}>
                {user.banned ? 'Unblock' : 'Block'}<span className="sr-only"> {user.name}</span>
              </button>
            )}
          </div>
        )}
      </td>
    </tr>
  );
}

function People({ installations, selfId }: { installations: string[]; selfId: string }) {
  const users = useQuery({ queryKey: ['users'], queryFn: () => api<{ items: UserRow[] }>('/api/users') });
  return (
    <div className="space-y-6">
      <NewPerson installations={installations} />
      <section className="space-y-2" aria-labelledby="people-list">
        <h2 id="people-list">Accounts</h2>
        {users.isPending && <p role="status">Loading accounts…</p>}
        {users.isError && <p className="notice-error" role="alert">Could not load accounts: {(users.error as Error).message}</p>}
        {users.data && (users.data.items.length === 0 ? <p className="notice-info">No accounts.</p> : (
          <div className="card overflow-x-auto p-0">
            <table className="data-table">
              <thead><tr><th scope="col">Person</th><th scope="col">Role</th><th scope="col">Installations</th><th scope="col">Status</th><th scope="col"><span className="sr-only">Actions</span></th></tr></thead>
              <tbody>{users.data.items.map((u) => <PersonRow key={u.id} user={u} installations={installations} selfId={selfId} />)}</tbody>
            </table>
          </div>
        ))}
      </section>
    </div>
  );
}

export default function PeopleAdmin(props: { installations: string[]; selfId: string }) {
  return (
    <QueryProvider>
      <People {...props} />
    </QueryProvider>
  );
}
