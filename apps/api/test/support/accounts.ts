import type { TestAgent } from './app.js';
import { uniqueEmail } from './factories.js';
import { type SinkMessage, waitForMessages } from './mail-sink.js';

/** A password the policy accepts (long, not a common one). */
export const NEW_PASSWORD = 'lantern over the quiet ridge 7';

export const registration = (overrides: Record<string, unknown> = {}) => ({
  name: 'Rosalind Test-Person',
  email: uniqueEmail('reg'),
  affiliation: 'Example Institute of Radio Physics',
  country: 'NZ',
  password: NEW_PASSWORD,
  ...overrides,
});

/** The token of the link to `route` (`/verify`, `/reset-password`) in an e-mail's text. */
export function tokenFrom(message: SinkMessage, route: '/verify' | '/reset-password'): string {
  const escaped = route.replace('/', '\\/');
  const match = new RegExp(`${escaped}\\?token=([A-Za-z0-9_-]+)`).exec(message.text ?? '');
  if (!match?.[1]) throw new Error(`no ${route} link in "${message.subject}"`);
  return match[1];
}

/**
 * The newest message to the address whose subject matches, once `count` messages are in and one
 * of them matches (other mail to the same address may arrive first).
 */
export async function latestMessage(
  address: string,
  count: number,
  subject: RegExp,
  timeoutMs = 15000,
): Promise<SinkMessage> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    // The sink lists the newest first.
    const list = await waitForMessages(address, count, Math.max(deadline - Date.now(), 1));
    const match = list.find((m) => subject.test(m.subject));
    if (match) return match;
    if (Date.now() > deadline) throw new Error(`no message matching ${subject} to ${address}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

/** Registers through the API and confirms the address from the e-mailed link. */
export async function registerAndVerify(agent: TestAgent, overrides: Record<string, unknown> = {}) {
  const body = registration(overrides);
  const res = await agent.post('/api/auth/register', body);
  if (res.status !== 202) throw new Error(`register answered ${res.status}`);
  const mail = await latestMessage(body.email, 1, /Confirm your e-mail/);
  const verified = await agent.post('/api/auth/verify', { token: tokenFrom(mail, '/verify') });
  if (verified.status !== 204) throw new Error(`verify answered ${verified.status}`);
  return body;
}
