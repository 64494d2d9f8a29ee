/**
 * The Members page's forms as Astro Actions (`actions.members.*`), for the shop's Owner: invite,
 * resend or withdraw an invitation, change a role, remove a member, shop settings. Invitations
 * count against the invite form's budgets and the mail budgets before anything is sent.
 */
import { defineAction, type ActionAPIContext } from 'astro:actions';
import { inviteMember, resendInvitation, revokeInvitation } from '~/lib/accounts/invitations.server.ts';
import { inMinutes, tooManyMessage } from '~/lib/accounts/limits.ts';
import { limitRequest } from '~/lib/accounts/limits.server.ts';
import { changeRole, removeMember } from '~/lib/accounts/members.server.ts';
import type { Outcome } from '~/lib/accounts/outcome.ts';
import { setShopTimeZone, setShopCurrency } from '~/lib/accounts/users.server.ts';
import { CAN, type SessionUser } from '~/lib/auth/index.server.ts';
import { clientIp } from '~/lib/http/client-ip.ts';
import { fieldsOf, parseFields, textOf } from '~/lib/http/form-post.server.ts';
import { limitMail } from '~/lib/mail/mail-budgets.server.ts';
import { invitationActionSchema, inviteSchema, memberRemoveSchema, memberRoleSchema, shopSettingsSchema } from '~/lib/schemas/account.ts';
import { formDone, formRefused, type FormOutcome } from '~/lib/http/form-outcome.ts';
import { signedInAs } from '~/lib/http/action-guard.ts';

/** An unreadable row form (a tampered hidden id) is answered 404, like an unknown row. */
const NO_SUCH_ROW: FormOutcome = formRefused(404, {}, { blank: true });

/** Counts one invitation e-mail against the form's budgets, then the owner's and the shop's mail budgets. */
async function inviteAllowed(context: ActionAPIContext, owner: SessionUser, person: string): Promise<{ ok: true } | { ok: false; retryAfterSeconds: number; message: string }> {
  const form = await limitRequest('invite', { address: clientIp(context), person });
  if (!form.ok) return { ...form, message: tooManyMessage(form.retryAfterSeconds) };
  const mail = await limitMail('invitation', { userId: owner.id, shopId: owner.shopId }, new Date());
  if (!mail.ok) return { ...mail, message: `This shop has sent as many invitations as it may for now. Try again ${inMinutes(mail.retryAfterSeconds)}.` };
  return { ok: true };
}

/** A service's outcome for a form on one row: a refusal other than 404 shows beside that row. */
function rowOutcome(outcome: Outcome, rowId: string): FormOutcome {
  if (outcome.ok) return formDone();
  const { status, errors, message } = outcome;
  return formRefused(status, errors, { ...(message === undefined ? {} : { message }), ...(status === 404 ? {} : { rowId }) });
}

const inviter = (owner: SessionUser) => ({ shopId: owner.shopId, userId: owner.id, displayName: owner.displayName });

export const members = {
  invite: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const owner = signedInAs(context, CAN.manageMembers);
      const fields = fieldsOf(form);
      const values = { email: textOf(fields, 'email'), role: textOf(fields, 'role') || 'builder' };
      const parsed = parseFields(fields, inviteSchema);
      if (!parsed.ok) return formRefused(400, parsed.errors, { values });
      const limit = await inviteAllowed(context, owner, parsed.data.email);
      if (!limit.ok) return formRefused(429, {}, { message: limit.message, retryAfterSeconds: limit.retryAfterSeconds, values });
      const outcome = await inviteMember(inviter(owner), parsed.data.email, parsed.data.role);
      if (outcome.ok) return formDone();
      // A refusal about the address shows beside the field; any other above the page.
      return outcome.errors.email ? formRefused(outcome.status, outcome.errors, { values }) : formRefused(outcome.status, {}, { message: outcome.message ?? Object.values(outcome.errors)[0] ?? 'That did not work.', values });
    },
  }),

  resend: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const owner = signedInAs(context, CAN.manageMembers);
      const parsed = parseFields(fieldsOf(form), invitationActionSchema);
      if (!parsed.ok) return NO_SUCH_ROW;
      const rowId = `invitation-${parsed.data.invitationId}`;
      const limit = await inviteAllowed(context, owner, `invitation:${parsed.data.invitationId}`);
      if (!limit.ok) return formRefused(429, {}, { message: limit.message, retryAfterSeconds: limit.retryAfterSeconds, rowId });
      return rowOutcome(await resendInvitation(inviter(owner), parsed.data.invitationId), rowId);
    },
  }),

  revoke: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const owner = signedInAs(context, CAN.manageMembers);
      const parsed = parseFields(fieldsOf(form), invitationActionSchema);
      if (!parsed.ok) return NO_SUCH_ROW;
      return rowOutcome(await revokeInvitation(owner.shopId, parsed.data.invitationId), `invitation-${parsed.data.invitationId}`);
    },
  }),

  role: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const owner = signedInAs(context, CAN.manageMembers);
      const parsed = parseFields(fieldsOf(form), memberRoleSchema);
      if (!parsed.ok) return formRefused(400, {}, { message: Object.values(parsed.errors)[0] ?? 'That did not work.' });
      return rowOutcome(await changeRole(owner.shopId, parsed.data.userId, parsed.data.role), `member-${parsed.data.userId}`);
    },
  }),

  remove: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const owner = signedInAs(context, CAN.manageMembers);
      const parsed = parseFields(fieldsOf(form), memberRemoveSchema);
      if (!parsed.ok) return NO_SUCH_ROW;
      const outcome = rowOutcome(await removeMember(owner.shopId, parsed.data.userId), `member-${parsed.data.userId}`);
      // An Owner who removed themselves is signed out with it.
      return outcome.ok && parsed.data.userId === owner.id ? formDone('/sign-in') : outcome;
    },
  }),

  settings: defineAction({
    accept: 'form',
    handler: async (form, context): Promise<FormOutcome> => {
      const owner = signedInAs(context, CAN.manageMembers);
      const parsed = parseFields(fieldsOf(form), shopSettingsSchema);
      if (!parsed.ok) return formRefused(400, parsed.errors);
      await setShopTimeZone(owner.shopId, parsed.data.timeZone);
      await setShopCurrency(owner.shopId, parsed.data.currency);
      return formDone();
    },
  }),
};
