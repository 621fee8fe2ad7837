import { validationFailed } from '../common/errors/app-error.js';

/** One answer for a token that is unknown, used or expired: which of them does not matter. */
export const invalidToken = () =>
  validationFailed(
    [{ path: 'token', message: 'This link has expired or has already been used' }],
    'This link has expired or has already been used',
  );
