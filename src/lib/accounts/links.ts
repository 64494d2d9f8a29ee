/** Addresses and lifetimes of the single-use links Kerfline e-mails. */
export const INVITATION_TTL_MS = 7 * 24 * 3_600_000;
export const RESET_TTL_MS = 3_600_000;

export const invitationUrl = (origin: string, token: string) => `${origin}/invitations/${token}`;
export const resetUrl = (origin: string, token: string) => `${origin}/reset-password/${token}`;
