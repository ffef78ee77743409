/**
 * The role sets routes are allowed to, written once. A route names one of these (or 'public' / 'member')
 * beside its handler; the permission table is built from those declarations (permissions.ts).
 */
import { roleSchema, type Role } from '../schemas/roles';

export const ALL_ROLES: readonly Role[] = roleSchema.options;

/** Team membership, invites, the team log, the queue and the plan: the owner's alone. */
export const OWNER: Role[] = ['owner'];

/** Those who shape the work: characters and their legs, courses and suites, leg setups, trials and dial-ins. */
export const EDITORS: Role[] = ['owner', 'designer'];

/**
 * Publishing leg profiles. The programmer consumes profiles and gates builds on them; keeping publish out of that
 * role means the one who gates a build cannot also make its gate pass by republishing.
 */
export const PUBLISHERS: Role[] = EDITORS;

/** Build scripts are the programmer's; the owner manages everything. */
export const TOKEN_KEEPERS: Role[] = ['owner', 'programmer'];
