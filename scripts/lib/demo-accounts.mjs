// @ts-check
/** The demo's sign-ins, one per role, printed by `npm start` and listed in the README. */
export const DEMO_ACCOUNTS = [
  { email: 'proposer@skyhours.test', role: 'proposer: writes and submits proposals' },
  { email: 'referee@skyhours.test', role: 'referee: reviews assigned proposals' },
  { email: 'chair@skyhours.test', role: 'chair: ranks and allocates a call' },
  { email: 'staff@skyhours.test', role: 'staff: array, calls, assessments, plan' },
  { email: 'admin@skyhours.test', role: 'admin: accounts and roles' },
];
