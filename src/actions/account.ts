/**
 * The Account page's forms as Astro Actions (`actions.account.*`): preferred units and the
 * password change. Plain HTML forms post them to /account (they work without JavaScript); the
 * page renders the outcome.
 */
import { defineAction } from 'astro:actions';
import { changePassword, setPreferredUnits } from '~/lib/accounts/account-settings.server.ts';
import { tooManyMessage } from '~/lib/accounts/limits.ts';
import { attemptSucceeded, limitRequest } from '~/lib/accounts/limits.server.ts';
import { clientIp } from '~/lib/http/client-ip.ts';
import { fieldsOf, parseFields } from '~/lib/http/form-post.server.ts';
import { ROLES, changePasswordSchema, preferencesSchema } from '~/lib/schemas/account.ts';
import { formDone, formRefused, type FormOutcome } from '~/lib/http/form-outcome.ts';
import { signedInAs } from '~/lib/http/action-guard.ts';

export const account = {
  units: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const user = signedInAs(context, ROLES);
      const parsed = parseFields(fieldsOf(form), preferencesSchema);
      if (!parsed.ok) return formRefused(400, parsed.errors);
      await setPreferredUnits(user.id, parsed.data.preferredUnits);
      return formDone();
    },
  }),

  password: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const user = signedInAs(context, ROLES);
      const parsed = parseFields(fieldsOf(form), changePasswordSchema);
      if (!parsed.ok) return formRefused(400, parsed.errors);
      const who = { address: clientIp(context), person: user.email };
      // Counted before the current password is checked; given back when it was right.
      const allowed = await limitRequest('change-password', who);
      if (!allowed.ok) return formRefused(429, {}, { message: tooManyMessage(allowed.retryAfterSeconds), retryAfterSeconds: allowed.retryAfterSeconds });
      const result = await changePassword(user.id, context.locals.sessionId, parsed.data.currentPassword, parsed.data.password);
      if (!result.ok) return formRefused(result.status, result.errors);
      await attemptSucceeded('change-password', who);
      return formDone();
    },
  }),
};
