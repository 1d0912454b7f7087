import type { Role } from '@shared/api';

/** What each role does in Bellkeep, in a sentence or two for the person holding it. */
export const ROLE_DUTIES: Readonly<Record<Role, string>> = {
  admin: 'You decide who works in Bellkeep: you add people, give them their roles and deactivate ' + 'accounts that are no longer needed.',
  experimentalist:
    'Before a night, the Planner tells you how many rounds to take and what share to test. You ' +
    'upload the per-round log of each night’s run; Bellkeep audits its test rounds and gives the ' +
    'run an accept or abort verdict.',
  'shift-lead': 'You learn each run’s verdict by morning, sign it off and decide what happens to the ' + 'hardware next.',
  auditor:
    'You re-open archived verdicts on the Audit page: check that a stored result and its log are ' +
    'still what was signed, re-analyse it from the archived log so every figure can be reproduced ' +
    'exactly, and read or export the whole trail.',
};
