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
  operationsAssessments: '/operations/assessments',
  operationsPlans: '/operations/plans',
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

/** A referee's page for one assignment: the proposal to read, conflicts, the review form. */
export const reviewHref = (assignmentId: string) =>
  `${paths.reviewing}/${encodeURIComponent(assignmentId)}`;

/** The chair's standing of one call. */
export const standingHref = (code: string) => `${paths.standing}/${encodeURIComponent(code)}`;

/** The chair's referee assignments of one call. */
export const refereeAssignmentsHref = (code: string) => `${standingHref(code)}/referees`;

/** Staff's technical assessments of one call's proposals. */
export const assessmentsHref = (code: string) =>
  `${paths.operationsAssessments}/${encodeURIComponent(code)}`;

/** Staff's observing plan of one call. */
export const planHref = (code: string) => `${paths.operationsPlans}/${encodeURIComponent(code)}`;

/** Staff's form for changing a call. */
export const editCallHref = (code: string) =>
  `${paths.operationsCalls}/${encodeURIComponent(code)}/edit`;

/** The sign-in screen, asked to come back to `next` (a path inside the app) afterwards. */
export function signInHref(next?: string): string {
  if (!next || next === paths.desk || next.startsWith(paths.signIn)) return paths.signIn;
  return `${paths.signIn}?${new URLSearchParams({ next }).toString()}`;
}
