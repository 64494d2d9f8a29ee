import { z } from 'zod';
import { depositInputSchema, type DepositSummary } from './deposit.ts';

/**
 * Proofs: what a builder sends to a client, and what the client answers. Shared by the builder's
 * panel, the client's proof page, the API routes and the database layer.
 */
export const PROOF_LIMITS = {
  nameMaxChars: 120,
  emailMaxChars: 254,
  messageMaxChars: 2000,
  commentMaxChars: 2000,
  minExpiryDays: 1,
  maxExpiryDays: 365,
  defaultExpiryDays: 30,
} as const;

const personName = z
  .string()
  .trim()
  .min(1, { message: 'must not be empty' })
  .max(PROOF_LIMITS.nameMaxChars, { message: `must be at most ${PROOF_LIMITS.nameMaxChars} characters` });

export const createProofSchema = z
  .object({
    clientName: personName,
    clientEmail: z
      .string()
      .trim()
      .max(PROOF_LIMITS.emailMaxChars, { message: `must be at most ${PROOF_LIMITS.emailMaxChars} characters` })
      .email({ message: 'must be an e-mail address' })
      .transform((email) => email.toLowerCase()),
    message: z
      .string()
      .max(PROOF_LIMITS.messageMaxChars, { message: `must be at most ${PROOF_LIMITS.messageMaxChars} characters` })
      .default(''),
    expiresInDays: z
      .number()
      .int({ message: `must be a whole number of days from ${PROOF_LIMITS.minExpiryDays} to ${PROOF_LIMITS.maxExpiryDays}` })
      .min(PROOF_LIMITS.minExpiryDays, { message: `must be at least ${PROOF_LIMITS.minExpiryDays} day` })
      .max(PROOF_LIMITS.maxExpiryDays, { message: `must be at most ${PROOF_LIMITS.maxExpiryDays} days` })
      .default(PROOF_LIMITS.defaultExpiryDays),
    /** A deposit the client pays on approving (docs/payments.md); none when left out. */
    deposit: depositInputSchema.optional(),
  })
  .strict();

export type CreateProofInput = z.infer<typeof createProofSchema>;

/** The client's answer: approve with a typed name and a ticked confirmation, or ask for changes. */
export const decisionSchema = z.discriminatedUnion('decision', [
  z
    .object({
      decision: z.literal('approved'),
      name: personName,
      confirmed: z.literal(true, { errorMap: () => ({ message: 'must be ticked to approve' }) }),
    })
    .strict(),
  z
    .object({
      decision: z.literal('changes_requested'),
      name: personName,
      comment: z
        .string()
        .trim()
        .min(1, { message: 'must say what should change' })
        .max(PROOF_LIMITS.commentMaxChars, { message: `must be at most ${PROOF_LIMITS.commentMaxChars} characters` }),
    })
    .strict(),
]);

export type DecisionInput = z.infer<typeof decisionSchema>;
export type DecisionKind = DecisionInput['decision'];

export interface ProofDecision {
  kind: DecisionKind;
  /** ISO 8601. */
  at: string;
  name: string;
  comment: string;
}

/** Where a proof stands: open until decided; a revoked or expired link no longer opens. */
export type ProofState = 'open' | DecisionKind | 'revoked' | 'expired';

/** A proof as the builder sees it in the list of a design's proofs. */
export interface ProofSummary {
  id: number;
  revision: number;
  /** The pinned revision's fingerprint. */
  fingerprint: string;
  clientName: string;
  clientEmail: string;
  message: string;
  createdAt: string;
  expiresAt: string;
  revokedAt: string | null;
  state: ProofState;
  decision: ProofDecision | null;
  /** The deposit asked with this proof, and whether the payment service confirmed it. */
  deposit: DepositSummary | null;
}

/** Answer of POST /api/boards/{id}/proofs: the link is shown once, since only its hash is kept. */
export interface CreatedProof {
  proof: ProofSummary;
  link: string;
  /** False when the e-mail to the client could not be sent; the builder can still copy the link. */
  mailed: boolean;
}

/** A proof in a client's "Shared with me" list. */
export interface SharedProof {
  id: number;
  boardName: string;
  revision: number;
  createdAt: string;
  expiresAt: string;
  state: ProofState;
  decision: ProofDecision | null;
}

export const PROOF_STATE_LABELS: Readonly<Record<ProofState, string>> = {
  open: 'awaiting answer',
  approved: 'approved',
  changes_requested: 'changes requested',
  revoked: 'revoked',
  expired: 'expired',
};
