import type { OutgoingEmail } from '../mail/mail.service.js';
import { hoursText, utcText } from './proposal-checks.js';

interface ProposalRef {
  reference: string;
  title: string;
}

const proposalUrl = (base: string, reference: string) =>
  `${base}/proposals/${encodeURIComponent(reference)}`;
const quoted = (p: ProposalRef) => `${p.reference} “${p.title || 'untitled'}”`;

/** The invitation of a Co-I: its words and link depend on whether the address has an account. */
export function invitationEmail(args: {
  base: string;
  proposal: ProposalRef;
  callCode: string;
  email: string;
  inviter: string;
  canEdit: boolean;
  account: { name: string; verified: boolean } | null;
}): OutgoingEmail {
  const { base, proposal, callCode, email, inviter, canEdit, account } = args;
  const what = `${inviter} has added you as a co-investigator (Co-I) of proposal ${quoted(proposal)} to call ${callCode}${canEdit ? ', with the right to edit it' : ''}.`;
  const subject = `You are invited to proposal ${proposal.reference}`;
  if (account?.verified)
    return {
      to: email,
      subject,
      kind: 'proposal.invitation',
      content: {
        greeting: `Dear ${account.name},`,
        paragraphs: [what, 'It is now on your list of proposals in Skyhours.'],
        action: { label: 'Open the proposal', url: proposalUrl(base, proposal.reference) },
      },
    };
  if (account)
    return {
      to: email,
      subject,
      kind: 'proposal.invitation',
      content: {
        greeting: `Dear ${account.name},`,
        paragraphs: [
          what,
          'Your account’s address is not confirmed yet: confirm it (sign in to have the confirmation sent again) and the proposal will be on your list.',
        ],
        action: { label: 'Sign in', url: `${base}/sign-in` },
      },
    };
  return {
    to: email,
    subject,
    kind: 'proposal.invitation',
    content: {
      greeting: 'Hello,',
      paragraphs: [
        what,
        'There is no Skyhours account at this address yet. Register with this address and confirm it; the proposal will be waiting on your list.',
      ],
      action: { label: 'Register', url: `${base}/register?email=${encodeURIComponent(email)}` },
    },
  };
}

export function newPiEmail(args: {
  base: string;
  proposal: ProposalRef;
  to: { email: string; name: string };
  from: string;
}): OutgoingEmail {
  return {
    to: args.to.email,
    subject: `You are now the PI of proposal ${args.proposal.reference}`,
    kind: 'proposal.pi-handed-over',
    content: {
      greeting: `Dear ${args.to.name},`,
      paragraphs: [
        `${args.from} has made you the principal investigator (PI) of proposal ${quoted(args.proposal)}. ${args.from} stays on the team as a Co-I with the right to edit.`,
      ],
      action: { label: 'Open the proposal', url: proposalUrl(args.base, args.proposal.reference) },
    },
  };
}

export function receiptEmail(args: {
  base: string;
  proposal: ProposalRef;
  callCode: string;
  versionNumber: number;
  submittedAt: Date;
  submittedBy: string;
  totalHours: number;
  to: { email: string; name: string };
  pdf: { filename: string; content: Buffer } | null;
}): OutgoingEmail {
  const { proposal, versionNumber } = args;
  return {
    to: args.to.email,
    subject: `Submitted: ${proposal.reference} version ${versionNumber}`,
    kind: 'proposal.receipt',
    content: {
      greeting: `Dear ${args.to.name},`,
      paragraphs: [
        `${args.submittedBy} submitted proposal ${quoted(proposal)} to call ${args.callCode} at ${utcText(args.submittedAt)}. This is version ${versionNumber}; it asks for ${hoursText(args.totalHours)} h.`,
        args.pdf
          ? 'The compiled PDF, exactly as the reviewers will read it, is attached.'
          : 'The compiled PDF is too large to attach; download it from the proposal.',
        'Until the deadline the proposal can be reopened, changed and submitted again; every submitted version is kept.',
      ],
      action: { label: 'Open the proposal', url: proposalUrl(args.base, proposal.reference) },
    },
    attachments: args.pdf
      ? [{ filename: args.pdf.filename, contentType: 'application/pdf', content: args.pdf.content }]
      : [],
  };
}

export function reminderEmail(args: {
  base: string;
  proposal: ProposalRef;
  callCode: string;
  deadlineAt: Date;
  now: Date;
  submittedVersion: number | null;
  to: { email: string; name: string };
}): OutgoingEmail {
  const hoursLeft = (args.deadlineAt.getTime() - args.now.getTime()) / 3_600_000;
  const left =
    hoursLeft >= 36
      ? `${Math.round(hoursLeft / 24)} days`
      : `${Math.max(1, Math.round(hoursLeft))} hours`;
  return {
    to: args.to.email,
    subject: `Deadline in ${left}: ${args.proposal.reference} is not submitted`,
    kind: 'proposal.reminder',
    content: {
      greeting: `Dear ${args.to.name},`,
      paragraphs: [
        `The deadline of call ${args.callCode} is ${utcText(args.deadlineAt)}, in about ${left}, and proposal ${quoted(args.proposal)} is a draft that has not been submitted.`,
        args.submittedVersion
          ? `It was reopened after version ${args.submittedVersion} was submitted: submit it again for your changes to count.`
          : 'Submissions close at the deadline by the server’s clock; late proposals cannot be accepted.',
      ],
      action: { label: 'Open the proposal', url: proposalUrl(args.base, args.proposal.reference) },
    },
  };
}
