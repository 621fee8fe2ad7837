import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/** Where a form shows an error that belongs to no single field. */
export const FORM_ERROR = 'root.server' as const;

/**
 * Puts the server's answer on a react-hook-form form: each `issues[]` entry under its field,
 * anything else (no issues, an issue without a path, a network failure) as the form's own error
 * at `errors.root.server`. The first field with an issue takes focus.
 *
 * `fields`, when given, lists the paths this form has; issues about other paths (a server rule
 * the form does not show) go to the form error with their path named, so none is lost.
 */
export function setServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields?: readonly Path<T>[],
): void {
  const formError = (message: string) => setError(FORM_ERROR, { type: 'server', message });

  if (!isApiError(error)) {
    formError(error instanceof Error ? error.message : 'Something went wrong.');
    return;
  }
  if (error.issues.length === 0) {
    formError(error.message);
    return;
  }

  const unplaced: string[] = [];
  let focused = false;
  for (const issue of error.issues) {
    // Accept `items[0].name` as well as `items.0.name`.
    const path = issue.path.replace(/\[(\d+)\]/g, '.$1');
    if (path === '' || (fields && !fields.includes(path as Path<T>))) {
      unplaced.push(path ? `${path}: ${issue.message}` : issue.message);
      continue;
    }
    setError(
      path as Path<T>,
      { type: 'server', message: issue.message },
      { shouldFocus: !focused },
    );
    focused = true;
  }
  if (unplaced.length > 0) formError(unplaced.join(' '));
}
