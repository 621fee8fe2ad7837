import type { OutgoingEmail } from '../mail/mail.service.js';

/** To each member of the team once everything granted to their proposal has been observed. */
export function completedEmail(args: {
  base: string;
  to: { email: string; name: string | null };
  reference: string;
  title: string;
  observedHours: number;
  grantedHours: number;
}): OutgoingEmail {
  const { base, to, reference, title, observedHours, grantedHours } = args;
  const hours = (h: number) => `${Math.round(h * 100) / 100} h`;
  return {
    to: to.email,
    subject: `Observations of ${reference} are complete`,
    kind: 'plan.proposal_completed',
    content: {
      greeting: to.name ? `Dear ${to.name},` : 'Hello,',
      paragraphs: [
        `Every observation granted to proposal ${reference} “${title || 'untitled'}” has now been observed: ${hours(observedHours)} obtained of the ${hours(grantedHours)} granted.`,
        'The proposal is marked completed. The observatory staff will tell you how to collect the data.',
      ],
      action: {
        label: 'See the progress',
        url: `${base}/proposals/${encodeURIComponent(reference)}`,
      },
    },
  };
}
