import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/**
 * Puts an API failure onto a form: each `fields` entry the form knows goes next to its field
 * (the first one is focused); anything else becomes the form-level message in `root.server`.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  knownFields: readonly Path<T>[],
): void {
  if (!isApiError(error)) {
    setError('root.server', {
      type: 'server',
      message: 'Something unexpected happened. Try again.',
    });
    return;
  }
  let placed = 0;
  for (const [field, message] of Object.entries(error.fields ?? {})) {
    const name = field as Path<T>;
    if (knownFields.includes(name)) {
      setError(name, { type: 'server', message }, { shouldFocus: placed === 0 });
      placed += 1;
    }
  }
  if (placed === 0) setError('root.server', { type: 'server', message: error.message });
}
