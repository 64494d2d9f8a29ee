/** Accounts, shops and members. POST bodies are valid, so statuses show authorisation. */
import type { MatrixIds, RouteCase } from './types.ts';

const everyone = (status: number) => ({ anonymous: status, client: status, builder: status, owner: status, otherOwner: status });
const signedIn = (status: number) => ({ ...everyone(status), anonymous: 302 });
const unique = (label: string) => `${label}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@matrix.example`;
/** The account and member forms are Astro Actions: they take form posts, as a browser sends them. */
const FORM = 'application/x-www-form-urlencoded';
const form = (fields: Record<string, string>) => new URLSearchParams(fields).toString();
/** Well-formed but never issued: the same "no longer valid" page as any dead link. */
const DEAD_TOKEN = 'MatrixNeverIssued00000';

export const ACCOUNT_ROUTES: readonly RouteCase[] = [
  { file: 'pages/sign-in.astro', method: 'GET', path: '/sign-in?next=/boards', expect: everyone(200) },
  { file: 'pages/sign-in.astro', method: 'POST', path: '/sign-in', body: () => ({ email: unique('nobody'), password: 'wrong-password' }), expect: everyone(401) },
  { file: 'pages/sign-out.ts', method: 'POST', path: '/sign-out', expect: everyone(303) },
  { file: 'pages/create-shop.astro', method: 'GET', path: '/create-shop', expect: everyone(200) },
  { file: 'pages/create-shop.astro', method: 'POST', path: '/create-shop', body: () => ({ shopName: 'Matrix Shop', email: unique('founder') }), expect: everyone(200) },
  { file: 'pages/forgot-password.astro', method: 'GET', path: '/forgot-password', expect: everyone(200) },
  { file: 'pages/forgot-password.astro', method: 'POST', path: '/forgot-password', body: () => ({ email: unique('forgetful') }), expect: everyone(200) },
  { file: 'pages/reset-password/[token].astro', method: 'GET', path: `/reset-password/${DEAD_TOKEN}`, expect: everyone(410) },
  { file: 'pages/reset-password/[token].astro', method: 'POST', path: `/reset-password/${DEAD_TOKEN}`, body: { password: 'new-password-1', confirmPassword: 'new-password-1' }, expect: everyone(410) },
  { file: 'pages/invitations/[token].astro', method: 'GET', path: `/invitations/${DEAD_TOKEN}`, expect: everyone(410) },
  { file: 'pages/invitations/[token].astro', method: 'POST', path: `/invitations/${DEAD_TOKEN}`, body: { displayName: 'Nobody', password: 'new-password-1', confirmPassword: 'new-password-1' }, expect: everyone(410) },
  { file: 'pages/account.astro', method: 'GET', path: '/account', expect: signedIn(200) },
  { file: 'pages/account.astro', method: 'POST', path: '/account?_action=account.units', contentType: FORM, body: form({ preferredUnits: 'mm' }), expect: signedIn(303) },
  { file: 'pages/members.astro', method: 'GET', path: '/members', expect: { anonymous: 302, client: 403, builder: 403, owner: 200, otherOwner: 200 } },
  {
    // Setting the demo Builder's role to what it already is: harmless for the demo Owner, and
    // "not found" for an Owner of another shop.
    file: 'pages/members.astro',
    method: 'POST',
    path: '/members?_action=members.role',
    contentType: FORM,
    body: (ids: MatrixIds) => form({ userId: ids.demoBuilderId, role: 'builder' }),
    expect: { anonymous: 302, client: 403, builder: 403, owner: 303, otherOwner: 404 },
  },
  {
    file: 'pages/members.astro',
    method: 'POST',
    path: '/members?_action=members.invite',
    contentType: FORM,
    body: () => form({ email: unique('invitee'), role: 'client' }),
    expect: { anonymous: 302, client: 403, builder: 403, owner: 303, otherOwner: 303 },
  },
  {
    // The demo shop's time zone and currency set to what the seed leaves them (UTC, USD): harmless for the demo Owner.
    file: 'pages/members.astro',
    method: 'POST',
    path: '/members?_action=members.settings',
    contentType: FORM,
    body: form({ timeZone: 'UTC', currency: 'USD' }),
    expect: { anonymous: 302, client: 403, builder: 403, owner: 303, otherOwner: 303 },
  },
  // Development outbox: the tests run in demo mode (production mode answers 404).
  { file: 'pages/outbox.astro', method: 'GET', path: '/outbox', expect: everyone(200) },
];
