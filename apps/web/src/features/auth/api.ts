import { api } from '@/lib/api-client';
import type { Session } from '@/features/session/api';

export interface Credentials {
  email: string;
  password: string;
}

export interface Registration {
  name: string;
  email: string;
  affiliation: string;
  /** ISO 3166-1 alpha-2 */
  country: string;
  orcid?: string;
  password: string;
}

/** The answer to a request whose outcome arrives by e-mail. */
export interface Accepted {
  message: string;
}

/** Sign-in answers the user and the CSRF token of the new (regenerated) session. */
export const signIn = (credentials: Credentials) =>
  api.post<Session & { csrfToken: string }>('/auth/login', credentials);

export const register = (registration: Registration) =>
  api.post<Accepted>('/auth/register', registration);

export const verifyEmail = (token: string) => api.post<void>('/auth/verify', { token });

export const requestPasswordReset = (email: string) =>
  api.post<Accepted>('/auth/password-reset', { email });

export const confirmPasswordReset = (token: string, password: string) =>
  api.post<void>('/auth/password-reset/confirm', { token, password });
