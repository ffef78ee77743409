import type { RouteRule } from '../permissions';

/**
 * Publishing is for the owner and the designer: the designer tunes and accepts dial-ins into new versions.
 * The programmer consumes profiles and gates builds on them; keeping publish out of that role means the one
 * who gates a build cannot also make its gate pass by republishing.
 */
const PUBLISHERS: RouteRule['access'] = ['owner', 'designer'];

/** Permission rules of the leg-profile routes (server/routes/profiles.ts). */
export const profileRules: RouteRule[] = [
  { method: 'GET', path: '/schema/leg-profile.json', action: 'profiles.schema', label: 'Read the leg profile JSON Schema', access: 'public' },
  { method: 'GET', path: '/profiles', action: 'profiles.read', label: 'See leg profiles and their versions', access: 'member' },
  { method: 'GET', path: '/profiles/:id', action: 'profiles.read', label: 'See leg profiles and their versions', access: 'member' },
  { method: 'GET', path: '/profiles/:id/diff', action: 'profiles.read', label: 'See leg profiles and their versions', access: 'member' },
  { method: 'POST', path: '/profiles', action: 'profiles.publish', label: 'Publish leg profile versions', access: PUBLISHERS },
  // Published versions never change: these answer 409 for everyone, so the refusal says why.
  { method: 'PUT', path: '/profiles/:id/versions/:version', action: 'profiles.read', label: 'See leg profiles and their versions', access: 'member' },
  { method: 'PATCH', path: '/profiles/:id/versions/:version', action: 'profiles.read', label: 'See leg profiles and their versions', access: 'member' },
  { method: 'DELETE', path: '/profiles/:id/versions/:version', action: 'profiles.read', label: 'See leg profiles and their versions', access: 'member' },
];
