import { paths } from '@/lib/paths';

/** The screens of signing in and of looking after one's own account. */
export const authPaths = {
  signIn: paths.signIn,
  register: '/register',
  /** The e-mailed confirmation link: `/verify?token=…` (the API writes these links). */
  verify: '/verify',
  forgotPassword: '/forgot-password',
  /** The e-mailed reset link: `/reset-password?token=…`. */
  resetPassword: '/reset-password',
} as const;

/**
 * Where to go after signing in: `next` when it is a path inside this app, else the Desk. A full
 * URL or a protocol-relative `//host` would send the user off the site (an open redirect).
 */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\'))
    return paths.desk;
  if (next.startsWith(authPaths.signIn)) return paths.desk;
  return next;
}
