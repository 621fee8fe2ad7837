import type { AccountStatus, GlobalRole } from './api';

export const ROLE_LABELS: Record<GlobalRole, string> = { staff: 'Staff', admin: 'Admin' };

export const STATUS_LABELS: Record<AccountStatus, string> = {
  active: 'Active',
  unverified: 'Address not confirmed',
  deactivated: 'Deactivated',
};

/** Audit actions in words; an action not listed shows as it is. */
export const ACTION_LABELS: Record<string, string> = {
  'auth.sign-in': 'Signed in',
  'auth.sign-in-failed': 'Failed sign-in',
  'auth.sign-out': 'Signed out',
  'auth.registered': 'Registered',
  'auth.register-existing': 'Registration with a taken address',
  'auth.email-verified': 'Confirmed the address',
  'auth.password-changed': 'Changed the password',
  'auth.password-change-failed': 'Wrong current password',
  'auth.password-reset-requested': 'Asked for a password reset',
  'auth.password-reset': 'Reset the password',
  'user.roles-changed': 'Roles changed',
  'user.deactivated': 'Deactivated',
  'user.reactivated': 'Reactivated',
  'user.profile-updated': 'Edited own details',
  'user.verification-resent': 'New confirmation link sent',
};

/** The audit log's filter choices. */
export const ACTION_FILTERS: { value: string; label: string }[] = [
  { value: '', label: 'Everything' },
  { value: 'auth.sign-in', label: 'Sign-ins' },
  { value: 'auth.sign-in-failed', label: 'Failed sign-ins' },
  { value: 'auth.password-changed', label: 'Password changes' },
  { value: 'user.roles-changed', label: 'Role changes' },
  { value: 'user.deactivated', label: 'Deactivations' },
  { value: 'auth.', label: 'All sign-in and password events' },
  { value: 'user.', label: 'All account changes' },
];
