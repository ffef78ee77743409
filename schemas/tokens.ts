import { z } from 'zod';

/** POST /api/tokens. */
export const createTokenSchema = z.object({
  name: z.string({ error: 'Name the token.' }).trim().min(1, 'Name the token, e.g. "CI build".').max(60, 'Use at most 60 characters.'),
});
export type CreateTokenInput = z.infer<typeof createTokenSchema>;

export const apiTokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  createdBy: z.object({ id: z.number().int(), name: z.string() }),
  createdAt: z.number().int(),
  lastUsedAt: z.number().int().nullable(),
  revokedAt: z.number().int().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;

export const apiTokenListSchema = z.object({ tokens: z.array(apiTokenSchema) });
export type ApiTokenList = z.infer<typeof apiTokenListSchema>;

/** The answer to a create: the only time the secret is ever shown. */
export const createdTokenSchema = z.object({ token: apiTokenSchema, secret: z.string() });
export type CreatedToken = z.infer<typeof createdTokenSchema>;

/** Tokens start with this, so a leaked one is easy to recognise in logs and secret scanners. */
export const TOKEN_PREFIX = 'tdl_';
