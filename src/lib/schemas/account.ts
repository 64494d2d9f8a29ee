/**
 * Accounts, shops and members: one zod schema per form, shared by the pages and the lib.
 * E-mail addresses are trimmed and lower-cased, so lookups are case-insensitive.
 */
import { z } from 'zod';
import { currencySchema } from './deposit.ts';
import { isTimeZone } from '~/lib/format/dates.ts';

/** A member's role in a shop (the database's enum is made from this list). */
export const ROLES = ['owner', 'builder', 'client'] as const;
export type Role = (typeof ROLES)[number];

/** Longest password accepted: long passphrases are welcome, megabytes of hashing input are not. */
export const MAX_PASSWORD_LENGTH = 200;
export const MIN_PASSWORD_LENGTH = 10;

export const emailSchema = z
  .string({ required_error: 'Enter an e-mail address' })
  .trim()
  .min(1, 'Enter an e-mail address')
  .max(254, 'An e-mail address has at most 254 characters')
  .email('Enter an e-mail address like name@example.com')
  .transform((e) => e.toLowerCase());

export const newPasswordSchema = z
  .string({ required_error: 'Enter a password' })
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters`)
  .max(MAX_PASSWORD_LENGTH, `Use at most ${MAX_PASSWORD_LENGTH} characters`);

/** A password being checked (sign-in, current password): only bounded, never judged. */
const givenPasswordSchema = z
  .string({ required_error: 'Enter your password' })
  .min(1, 'Enter your password')
  .max(MAX_PASSWORD_LENGTH, `Use at most ${MAX_PASSWORD_LENGTH} characters`);

const nameSchema = (what: string) =>
  z
    .string({ required_error: `Enter ${what}` })
    .trim()
    .min(1, `Enter ${what}`)
    .max(120, 'Use at most 120 characters');

export const roleSchema = z.enum(ROLES, { errorMap: () => ({ message: 'Choose Owner, Builder or Client' }) });
export const unitsSchema = z.enum(['mm', 'in'], { errorMap: () => ({ message: 'Choose mm or in' }) });

export const createShopSchema = z.object({ shopName: nameSchema('the shop name'), email: emailSchema });

export const signInSchema = z.object({ email: emailSchema, password: givenPasswordSchema });

export const forgotPasswordSchema = z.object({ email: emailSchema });

const withConfirmation = <T extends z.ZodRawShape>(shape: T) =>
  z
    .object({ ...shape, password: newPasswordSchema, confirmPassword: z.string({ required_error: 'Repeat the password' }) })
    .refine((v) => v.password === v.confirmPassword, { path: ['confirmPassword'], message: 'The two passwords differ' });

export const resetPasswordSchema = withConfirmation({});

export const acceptInvitationSchema = withConfirmation({ displayName: nameSchema('your name') });

export const changePasswordSchema = withConfirmation({ currentPassword: givenPasswordSchema });

export const preferencesSchema = z.object({ preferredUnits: unitsSchema });

export const inviteSchema = z.object({ email: emailSchema, role: roleSchema });

const idText = z.string({ required_error: 'Missing id' }).trim().min(1, 'Missing id').max(40, 'Unknown id');

export const invitationActionSchema = z.object({ invitationId: z.coerce.number({ invalid_type_error: 'Unknown invitation' }).int().positive() });

export const memberRoleSchema = z.object({ userId: idText, role: roleSchema });

export const memberRemoveSchema = z.object({ userId: idText });

export type CreateShopInput = z.infer<typeof createShopSchema>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

/** The Owner's shop settings (Members page). */
export const shopSettingsSchema = z.object({
  timeZone: z
    .string()
    .trim()
    .refine(isTimeZone, { message: 'choose a time zone from the list (for example Europe/London)' }),
  /** The currency deposits are asked in unless the builder names another (docs/payments.md). */
  currency: currencySchema,
});
export type ShopSettingsInput = z.infer<typeof shopSettingsSchema>;
