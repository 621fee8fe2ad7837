import type { OutgoingEmail } from '../mail/mail.service.js';

type Person = { email: string; name: string };

/** To the owner of an address someone tried to register again: nothing was changed. */
export const registrationAttemptEmail = (owner: Person, publicUrl: string): OutgoingEmail => ({
  to: owner.email,
  subject: 'Someone tried to register this address with Skyhours',
  kind: 'auth.register-existing',
  content: {
    greeting: `Dear ${owner.name},`,
    paragraphs: [
      'Someone tried to make a new Skyhours account with this e-mail address. You already have an account, so nothing was changed.',
      'If it was you, sign in with your password, or choose a new one if you have forgotten it.',
    ],
    action: { label: 'Choose a new password', url: `${publicUrl}/forgot-password` },
    after: ['If it was not you, you need not do anything.'],
  },
});

export const passwordResetEmail = (owner: Person, url: string, minutes: number): OutgoingEmail => ({
  to: owner.email,
  subject: 'Choose a new Skyhours password',
  kind: 'auth.reset',
  content: {
    greeting: `Dear ${owner.name},`,
    paragraphs: [
      'Someone, probably you, asked to choose a new password for your Skyhours account.',
    ],
    action: { label: 'Choose a new password', url },
    after: [
      `The link works once and for ${minutes} minutes. If you did not ask, ignore this message: your password stays as it is.`,
    ],
  },
});

export const passwordChangedEmail = (owner: Person, publicUrl: string): OutgoingEmail => ({
  to: owner.email,
  subject: 'Your Skyhours password was changed',
  kind: 'auth.password-changed',
  content: {
    greeting: `Dear ${owner.name},`,
    paragraphs: [
      'The password of your Skyhours account was just changed, and every other session of the account was signed out.',
      'If you did not do this, choose a new password at once and tell the observatory.',
    ],
    action: { label: 'Choose a new password', url: `${publicUrl}/forgot-password` },
  },
});
