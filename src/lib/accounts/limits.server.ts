/**
 * Rate limits of the account forms, on the shared limiter (src/lib/http/rate-limit.server.ts),
 * per client address and per person (the e-mail typed, or another per-person key). Budgets are in
 * src/lib/http/rate-budgets.ts. Every check counts before the work it guards, so concurrent
 * requests cannot slip past a budget.
 */
import { ACCOUNT_BUDGETS, SIGN_IN_BUDGETS, signInDelayMs } from '~/lib/http/rate-budgets.ts';
import { consume, consumeEach, countOf, forget, refund, type Counter, type LimitVerdict } from '~/lib/http/rate-limit.server.ts';

export type LimitedAction = 'create-shop' | 'forgot-password' | 'reset-password' | 'accept-invitation' | 'invite' | 'change-password';

export interface Who {
  /** The client address (clientIp). */
  address: string;
  /** Lower-cased e-mail address, or another per-person key such as `invitation:12`. */
  person?: string;
}

function countersOf(action: LimitedAction, who: Who): [Counter, string][] {
  const list: [Counter, string][] = [[{ name: `${action}-address`, budget: ACCOUNT_BUDGETS.perAddress }, who.address]];
  if (who.person) list.push([{ name: `${action}-person`, budget: ACCOUNT_BUDGETS.perPerson }, who.person]);
  if (action === 'create-shop') list.push([{ name: 'create-shop-mail-address', budget: ACCOUNT_BUDGETS.newShopMailsPerAddress }, who.address]);
  return list;
}

/** Counts this request against the action's budgets and says whether it may go on. */
export function limitRequest(action: LimitedAction, who: Who): Promise<LimitVerdict> {
  return consumeEach(countersOf(action, who));
}

/**
 * For actions that count failures only (change-password): after `limitRequest` counted the
 * attempt before the check, gives the points back when it was right.
 */
export async function attemptSucceeded(action: LimitedAction, who: Who): Promise<void> {
  await Promise.all(countersOf(action, who).map(([counter, key]) => refund(counter, key)));
}

const PAIR: Counter = { name: 'sign-in-pair', budget: SIGN_IN_BUDGETS.perAccountAndAddress };
const ADDRESS: Counter = { name: 'sign-in-address', budget: SIGN_IN_BUDGETS.perAddress };
const KNOWN_PAIR: Counter = { name: 'sign-in-known', budget: SIGN_IN_BUDGETS.knownPair };
const ACCOUNT: Counter = { name: 'sign-in-account', budget: SIGN_IN_BUDGETS.perAccount };

export interface SignInWho {
  address: string;
  /** The lower-cased e-mail typed, whether or not an account has it (no enumeration). */
  email: string;
}

const pairKey = (who: SignInWho) => `${who.email}|${who.address}`;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Before a password is checked (OWASP ASVS 2.2.1, OWASP Authentication Cheat Sheet): takes a
 * point from the (account, address) and the address budgets, refusing when either is spent. A
 * pair that signed in correctly before may still try while only its address is over budget. Then
 * waits the growing, capped delay that the account's failures from every address call for; that
 * delay slows a distributed guesser down but never refuses the owner.
 */
export async function beforePasswordCheck(who: SignInWho): Promise<LimitVerdict> {
  const pair = await consume(PAIR, pairKey(who));
  if (!pair.ok) return pair;
  const address = await consume(ADDRESS, who.address);
  if (!address.ok && (await countOf(KNOWN_PAIR, pairKey(who))) === 0) {
    await refund(PAIR, pairKey(who));
    return address;
  }
  const delay = signInDelayMs(await countOf(ACCOUNT, who.email));
  if (delay > 0) await sleep(delay);
  return { ok: true };
}

/**
 * After the check: a correct password clears its (account, address) counter, gives back its
 * address point and remembers the pair; a wrong one counts toward the account's delay.
 */
export async function afterPasswordCheck(who: SignInWho, correct: boolean): Promise<void> {
  if (correct) {
    await Promise.all([forget(PAIR, pairKey(who)), refund(ADDRESS, who.address), forget(KNOWN_PAIR, pairKey(who)).then(() => consume(KNOWN_PAIR, pairKey(who)))]);
  } else {
    await consume(ACCOUNT, who.email);
  }
}
