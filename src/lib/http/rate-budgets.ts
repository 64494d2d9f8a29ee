/**
 * Every rate limit budget in Kerfline, in one place (docs/operations.md, "Rate limits and client
 * addresses", lists them). A budget is `points` requests per fixed window of `seconds`, counted
 * in MariaDB so every app process shares it (src/lib/http/rate-limit.server.ts). Change numbers
 * here only, and the table in the docs with them.
 */

export interface Budget {
  /** Requests (or failures, for sign-in) allowed per window. */
  points: number;
  /** Length of the fixed window, in seconds. */
  seconds: number;
}

const MINUTE = 60;
const QUARTER_HOUR = 15 * MINUTE;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;

/**
 * Account forms, per client address and per person (the e-mail typed, or another per-person key).
 * Generous for people, far too low for guessing or for spraying mail at one inbox.
 */
export const ACCOUNT_BUDGETS = {
  perAddress: { points: 50, seconds: QUARTER_HOUR },
  perPerson: { points: 10, seconds: QUARTER_HOUR },
  /** Create-shop mails a link (with the shop name typed) to any address: per client address per hour. */
  newShopMailsPerAddress: { points: 20, seconds: HOUR },
} as const satisfies Record<string, Budget>;

/**
 * Sign-in (OWASP ASVS 2.2.1; OWASP Authentication Cheat Sheet, "Account lockout"): failures are
 * counted per (account, client address) and per client address, and a point is taken before the
 * password is checked, so concurrent guesses cannot run past the budget. A correct password clears
 * its (account, address) counter and gives its per-address point back. Failures for one account
 * from everywhere only slow its answers down; they never refuse a correct password.
 */
export const SIGN_IN_BUDGETS = {
  /** Wrong passwords for one account from one address; then 429 for the rest of the window. */
  perAccountAndAddress: { points: 10, seconds: QUARTER_HOUR },
  /** Wrong passwords from one address over every account (password spraying); then 429. */
  perAddress: { points: 50, seconds: QUARTER_HOUR },
  /**
   * How long an (account, address) pair that signed in correctly is remembered: such a pair may
   * still try while its address is over `perAddress`, so one guesser behind a shop's shared
   * connection does not lock out the people who work there.
   */
  knownPair: { points: 1, seconds: 30 * DAY },
  /** Window over which one account's failures from every address are counted for the delay. */
  perAccount: { points: 1_000_000, seconds: QUARTER_HOUR },
} as const satisfies Record<string, Budget>;

/** The delay before checking a password once one account has this many failures in the window. */
export const SIGN_IN_DELAY = {
  /** Failures (from any address) before answers start to slow down. */
  afterFailures: 10,
  /** Delay at `afterFailures`, in milliseconds; it doubles with each further failure. */
  firstMs: 125,
  /** Longest delay, in milliseconds. */
  maxMs: 2000,
} as const;

/**
 * CPU-heavy public routes, the public proof page and the public payment routes
 * (src/lib/http/route-budgets.ts says which paths), per client address and, when signed in, per user. Scripts call POST /api/layout and /api/scala in bulk and Boards
 * shows a thumbnail per row, hence their larger budgets; PDFs cost the most.
 */
export const ROUTE_BUDGETS = {
  layout: { perAddress: { points: 1200, seconds: MINUTE }, perUser: { points: 1200, seconds: MINUTE } },
  scala: { perAddress: { points: 600, seconds: MINUTE }, perUser: { points: 600, seconds: MINUTE } },
  export: { perAddress: { points: 60, seconds: MINUTE }, perUser: { points: 60, seconds: MINUTE } },
  'board-export': { perAddress: { points: 60, seconds: MINUTE }, perUser: { points: 60, seconds: MINUTE } },
  thumbnail: { perAddress: { points: 600, seconds: MINUTE }, perUser: { points: 600, seconds: MINUTE } },
  'template-label': { perAddress: { points: 60, seconds: MINUTE }, perUser: { points: 60, seconds: MINUTE } },
  'index-template': { perAddress: { points: 60, seconds: MINUTE }, perUser: { points: 60, seconds: MINUTE } },
  /** The public proof page (/p/{token}). Links carry 128 random bits: this keeps load off the database. */
  'proof-page': { perAddress: { points: 120, seconds: MINUTE }, perUser: { points: 120, seconds: MINUTE } },
  /** A client starting a deposit payment: each one asks the payment service for a pay page. */
  'deposit-checkout': { perAddress: { points: 20, seconds: MINUTE }, perUser: { points: 20, seconds: MINUTE } },
  /** The payment service's webhooks (signed; it sends from a few addresses, in bursts after an outage). */
  'payment-webhook': { perAddress: { points: 600, seconds: MINUTE }, perUser: { points: 600, seconds: MINUTE } },
} as const satisfies Record<string, { perAddress: Budget; perUser: Budget }>;

export type RouteBudgetName = keyof typeof ROUTE_BUDGETS;

/** Budgets this large are counted in reserved blocks (rate-limit.server.ts, `reserve`). */
const RESERVE_FROM_POINTS = 500;
/** A block is this share of the budget: at most 2 % of it can go unused per process at a window's end. */
const RESERVE_SHARE = 1 / 50;

/** How many points a process reserves at once for `budget` (1 = count every request in the database). */
export function reserveFor(budget: Budget, scale = 1): number {
  const points = scaledPoints(budget, scale);
  return points >= RESERVE_FROM_POINTS ? Math.floor(points * RESERVE_SHARE) : 1;
}

/**
 * A client's answers to proofs, per visitor (address, or user when signed in) and link, so one
 * visitor hammering one proof does not lock out other proofs behind the same office connection.
 */
export const PROOF_DECISION_BUDGET: Budget = { points: 10, seconds: MINUTE };

/** A shop younger than this gets the `young` mail budgets: a new shop is the cheapest sender to make. */
export const YOUNG_SHOP_SECONDS = DAY;

/**
 * E-mails that Kerfline sends on someone's behalf, per sending user and per shop, per hour. For
 * password resets the "user" is the account the reset is for (the sender has no account).
 */
export const MAIL_BUDGETS = {
  proof: {
    perUser: { points: 30, seconds: HOUR },
    perShop: { points: 60, seconds: HOUR },
    young: { perUser: { points: 10, seconds: HOUR }, perShop: { points: 10, seconds: HOUR } },
  },
  invitation: {
    perUser: { points: 20, seconds: HOUR },
    perShop: { points: 40, seconds: HOUR },
    young: { perUser: { points: 10, seconds: HOUR }, perShop: { points: 10, seconds: HOUR } },
  },
  'password-reset': {
    perUser: { points: 5, seconds: HOUR },
    perShop: { points: 20, seconds: HOUR },
    young: { perUser: { points: 3, seconds: HOUR }, perShop: { points: 5, seconds: HOUR } },
  },
} as const satisfies Record<string, { perUser: Budget; perShop: Budget; young: { perUser: Budget; perShop: Budget } }>;

export type MailKind = keyof typeof MAIL_BUDGETS;

/**
 * Multiplies every budget's points by `scale` (RATE_LIMIT_SCALE, 1 in normal use). Only for a
 * load-test server: its counters live under their own key prefix (see rate-limit.server.ts).
 */
export function scaledPoints(budget: Budget, scale: number): number {
  return Math.max(1, Math.round(budget.points * scale));
}

/** Seconds a refused caller should wait: whole seconds, at least 1. */
export function retryAfterSeconds(msBeforeNext: number): number {
  return Math.max(1, Math.ceil(msBeforeNext / 1000));
}

/** The growing, capped delay before a password check for an account with `failures` failures, in ms. */
export function signInDelayMs(failures: number): number {
  if (failures < SIGN_IN_DELAY.afterFailures) return 0;
  const doublings = Math.min(failures - SIGN_IN_DELAY.afterFailures, 20);
  return Math.min(SIGN_IN_DELAY.maxMs, SIGN_IN_DELAY.firstMs * 2 ** doublings);
}
