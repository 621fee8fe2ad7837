import type { OutgoingEmail } from '../mail/mail.service.js';
import type { Tier } from './standing-contract.js';

/** The tiers as PRODUCT.md names them, with what each means for the team. */
export const TIER_TEXT: Record<Tier, string> = {
  tier1: 'Tier 1 (will be scheduled)',
  tier2: 'Tier 2 (scheduled if time allows)',
  tier3: 'Tier 3 (filler)',
  not_allocated: 'not allocated',
};

/** Hours as people write them: 4 h, 2.5 h, 0.75 h. */
export const hours = (value: number) => `${Math.round(value * 100) / 100} h`;

export interface OutcomeFacts {
  reference: string;
  title: string;
  callCode: string;
  tier: Tier;
  hoursAsked: number;
  hoursGranted: number;
  observations: {
    targetName: string;
    configurationName: string;
    bandName: string;
    hoursAsked: number;
    hoursGranted: number;
  }[];
  /** The referees' comments to the PI, never their names. */
  comments: string[];
}

/** The one outcome e-mail of one person on one proposal's team. */
export function outcomeEmail(args: {
  base: string;
  to: { email: string; name: string | null };
  outcome: OutcomeFacts;
}): OutgoingEmail {
  const { base, to, outcome: o } = args;
  const allocated = o.tier !== 'not_allocated';
  const decision = allocated
    ? `The time-allocation committee has placed proposal ${o.reference} “${o.title}” of call ${o.callCode} in ${TIER_TEXT[o.tier]}, with ${hours(o.hoursGranted)} granted of the ${hours(o.hoursAsked)} asked.`
    : `The time-allocation committee could not allocate time to proposal ${o.reference} “${o.title}” of call ${o.callCode}: it is not allocated.`;
  const perObservation = allocated
    ? [
        'Granted per observation:',
        ...o.observations.map(
          (x) =>
            `• ${x.targetName} (${x.configurationName}, ${x.bandName}): ${hours(x.hoursGranted)} of ${hours(x.hoursAsked)} asked`,
        ),
      ]
    : [];
  const comments =
    o.comments.length === 0
      ? ['The referees left no comments for the PI.']
      : [
          `The referees’ comments to the PI (${o.comments.length}):`,
          ...o.comments.map((c, i) => `Comment ${i + 1}: ${c}`),
        ];
  return {
    to: to.email,
    subject: `Outcome of proposal ${o.reference}: ${allocated ? TIER_TEXT[o.tier].replace(/ \(.*\)$/, '') : 'not allocated'}`,
    kind: 'allocation.outcome',
    content: {
      greeting: to.name ? `Dear ${to.name},` : 'Hello,',
      paragraphs: [decision, ...perObservation, ...comments],
      action: {
        label: 'See the outcome',
        url: `${base}/proposals/${encodeURIComponent(o.reference)}`,
      },
    },
  };
}
