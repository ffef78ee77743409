import { z } from 'zod';
import { roleSchema } from './roles';
import { COMMON_PASSWORDS } from './common-passwords';

/** NIST SP 800-63B §5.1.1: at least 8 characters, at least 64 allowed, no composition rules. */
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That does not look like an e-mail address.' }));

/**
 * bcrypt reads only the first 72 bytes of a password (Provos & Mazières 1999, "A Future-Adaptable Password Scheme";
 * bcryptjs truncates the same way), so a longer one is refused rather than silently cut: 72 bytes is 72 plain
 * letters, fewer with accents or emoji.
 */
export const PASSWORD_MAX_BYTES = 72;
const utf8Bytes = (s: string) => new TextEncoder().encode(s).length;

export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters.`)
  .refine((p) => utf8Bytes(p) <= PASSWORD_MAX_BYTES, `Use at most ${PASSWORD_MAX_BYTES} bytes: that is 72 plain letters, fewer with accents or emoji. Longer passwords would be cut short without telling you.`)
  .refine((p) => !COMMON_PASSWORDS.has(p.toLowerCase()), 'That password is one of the most common ones; choose another.');

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(PASSWORD_MAX, 'Wrong e-mail or password.'),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const signUpSchema = z.object({
  name: z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(80, 'Use at most 80 characters.'),
  email: emailSchema,
  password: newPasswordSchema,
  teamName: z
    .string({ error: 'Name your studio.' })
    .trim()
    .min(1, 'Name your studio.')
    .max(80, 'Use at most 80 characters.'),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const userSchema = z.object({ id: z.number().int(), email: z.string(), name: z.string() });
export const teamSchema = z.object({ id: z.number().int(), name: z.string() });

export const membershipSummarySchema = z.object({ id: z.number().int(), name: z.string(), role: roleSchema });

export const meSchema = z.object({
  user: userSchema,
  team: teamSchema,
  role: roleSchema,
  /** Action names from the permission table that this role may take. */
  permissions: z.array(z.string()),
  /** Every studio this user belongs to, for the switcher in the header. */
  teams: z.array(membershipSummarySchema),
});
export type Me = z.infer<typeof meSchema>;

/** GET /api/me/session: signed out is a state, answered 200, so loading the app signed out logs no error. */
export const sessionStateSchema = z.discriminatedUnion('signedIn', [z.object({ signedIn: z.literal(false) }), z.object({ signedIn: z.literal(true), me: meSchema })]);
export type SessionState = z.infer<typeof sessionStateSchema>;

export const switchTeamSchema = z.object({ teamId: z.number({ error: 'Pick a studio.' }).int() });

export const signUpConfirmSchema = z.object({ token: z.string().min(1, 'This sign-up link is incomplete.').max(200, 'This sign-up link is not one of ours.') });

/** What sign-up answers, the same for every address. */
export const signUpAnswerSchema = z.object({ ok: z.literal(true), message: z.string() });
export type SignUpAnswer = z.infer<typeof signUpAnswerSchema>;

export const resetRequestSchema = z.object({ email: emailSchema });
export type ResetRequestInput = z.infer<typeof resetRequestSchema>;

export const resetPasswordSchema = z.object({
  token: z.string().min(1, 'This reset link is incomplete.'),
  password: newPasswordSchema,
});
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

/** Public facts about the running instance that the app needs before sign-in. */
export const appConfigSchema = z.object({
  /** The local mail catcher's inbox in development; absent in production. */
  localInboxUrl: z.string().optional(),
});
export type AppConfig = z.infer<typeof appConfigSchema>;
