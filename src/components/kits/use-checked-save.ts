/**
 * A form's save: check the values with the API's own schema first (messages beside each field),
 * then send; the server's refusal goes on top and beside the fields it names. Every kit-library
 * query is refreshed after a save.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { ZodType } from 'zod';
import { ApiError } from '../ui/api';

export function useCheckedSave<T>(schema: ZodType, values: unknown, send: () => Promise<T>, onSaved: (result: T) => void) {
  const qc = useQueryClient();
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const save = useMutation({
    mutationFn: send,
    onSuccess: async (result) => {
      await qc.invalidateQueries();
      onSaved(result);
    },
    onError: (e) => {
      if (e instanceof ApiError) {
        setFieldErrors(e.fields);
        setError(e.message);
      } else setError(String(e));
    },
  });
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    setError(null);
    const r = schema.safeParse(values);
    if (!r.success) {
      setFieldErrors(Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message])));
      return;
    }
    setFieldErrors({});
    save.mutate();
  };
  return { fieldErrors, error, submit, pending: save.isPending };
}
