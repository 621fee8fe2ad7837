/**
 * Every screen's address, in one place, so that links, the navigation and the router cannot
 * disagree. Features link to each other's screens through these, never through literals.
 */
export const paths = {
  desk: '/',
  calls: '/calls',
  calculator: '/calculator',
  proposals: '/proposals',
  newProposal: '/proposals/new',
  reviewing: '/reviewing',
  standing: '/standing',
  operations: '/operations',
  operationsArray: '/operations/array',
  operationsCalls: '/operations/calls',
  newCall: '/operations/calls/new',
  accounts: '/accounts',
  profile: '/profile',
  signIn: '/sign-in',
} as const;

/** A call's public page. */
export const callHref = (code: string) => `${paths.calls}/${encodeURIComponent(code)}`;

/** A proposal's editor, at one of its sections (Overview when none is named). */
export const proposalHref = (reference: string, section?: string) =>
  `${paths.proposals}/${encodeURIComponent(reference)}${section ? `/${section}` : ''}`;

/** The form that starts a proposal, with the call chosen when one is named. */
export const newProposalHref = (callCode?: string) =>
  callCode
    ? `${paths.newProposal}?${new URLSearchParams({ call: callCode }).toString()}`
    : paths.newProposal;

/** Staff's form for changing a call. */
export const editCallHref = (code: string) =>
  `${paths.operationsCalls}/${encodeURIComponent(code)}/edit`;

/** The sign-in screen, asked to come back to `next` (a path inside the app) afterwards. */
export function signInHref(next?: string): string {
  if (!next || next === paths.desk || next.startsWith(paths.signIn)) return paths.signIn;
  return `${paths.signIn}?${new URLSearchParams({ next }).toString()}`;
}
