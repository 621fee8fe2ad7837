import { ApiError, isApiError } from '@/lib/api-client';

/**
 * The same error with its issues' paths renamed to the form's field names (the server says
 * `line.restGHz`, the form calls the field `restGHz`). Paths the map does not know stay as they
 * are, so `setServerErrors` still shows them as the form's own error.
 */
export function withFieldPaths(error: unknown, fieldOf: (path: string) => string | null): unknown {
  if (!isApiError(error) || error.issues.length === 0) return error;
  return new ApiError(error.status, error.code, error.message, {
    issues: error.issues.map((issue) => ({ ...issue, path: fieldOf(issue.path) ?? issue.path })),
    body: error.body,
    cause: error,
  });
}

/**
 * The error to show apart from the form, or null: a 400 is the form's (each issue under its
 * field, the rest as the form's own error), anything else (409, 403, no answer) is not.
 */
export const apartFromFields = (error: unknown): unknown =>
  error && !isApiError(error, 400) ? error : null;
