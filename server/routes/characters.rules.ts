import type { RouteRule } from '../permissions';

/** Permission rules of the character routes (server/routes/characters.ts). */
export const characterRules: RouteRule[] = [];
