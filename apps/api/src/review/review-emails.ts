import type { OutgoingEmail } from '../mail/mail.service.js';
import { utcText } from '../proposals/proposal-checks.js';

/**
 * The e-mails of the review stage. They name the call, the proposals (reference and title) and
 * the due date, never a member of a proposal's team, so they are the same in anonymous calls.
 */

export interface AssignedProposal {
  reference: string;
  title: string;
}

interface RefereeAddress {
  email: string;
  name: string;
}

const reviewingUrl = (base: string) => `${base.replace(/\/$/, '')}/reviewing`;
const listed = (ps: AssignedProposal[]) =>
  ps.map((p) => `${p.reference} “${p.title || 'untitled'}”`).join('; ');
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export function assignmentEmail(args: {
  base: string;
  to: RefereeAddress;
  call: { code: string; title: string; reviewDueAt: Date };
  proposals: AssignedProposal[];
}): OutgoingEmail {
  const { call, proposals } = args;
  return {
    to: args.to.email,
    subject: `${plural(proposals.length, 'proposal', 'proposals')} to review for call ${call.code}`,
    kind: 'review.assigned',
    content: {
      greeting: `Dear ${args.to.name},`,
      paragraphs: [
        `You have been asked to review ${plural(proposals.length, 'proposal', 'proposals')} of call ${call.code} (${call.title}): ${listed(proposals)}.`,
        `Reviews are due ${utcText(call.reviewDueAt)}. If you are in conflict with a proposal, or cannot review it, say so on its page so the chair can find another referee.`,
      ],
      action: { label: 'Open Reviewing', url: reviewingUrl(args.base) },
    },
  };
}

export function reviewReminderEmail(args: {
  base: string;
  to: RefereeAddress;
  call: { code: string; reviewDueAt: Date };
  kind: '3d' | '1d';
  proposals: AssignedProposal[];
}): OutgoingEmail {
  const { call, proposals } = args;
  const left = args.kind === '3d' ? '3 days' : '1 day';
  return {
    to: args.to.email,
    subject: `Reviews for call ${call.code} are due in ${left}`,
    kind: 'review.reminder',
    content: {
      greeting: `Dear ${args.to.name},`,
      paragraphs: [
        `Your reviews for call ${call.code} are due ${utcText(call.reviewDueAt)}, in about ${left}, and ${plural(proposals.length, 'review is', 'reviews are')} not submitted yet: ${listed(proposals)}.`,
        'After the due date the server takes no more changes.',
      ],
      action: { label: 'Open Reviewing', url: reviewingUrl(args.base) },
    },
  };
}
