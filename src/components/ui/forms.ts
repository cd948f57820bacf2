/** Puts an API error on a react-hook-form: each named field gets its message, the rest goes on top. */
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api';

export function showApiError<T extends FieldValues>(e: unknown, setFieldError: UseFormSetError<T>, setFormError: (m: string) => void): void {
  if (!(e instanceof ApiError)) throw e;
  for (const [field, message] of Object.entries(e.fields)) setFieldError(field as Path<T>, { message });
  setFormError(e.message);
}
