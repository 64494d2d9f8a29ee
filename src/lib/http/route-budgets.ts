/**
 * Which requests count against which route budget (the numbers are ROUTE_BUDGETS in
 * rate-budgets.ts): the public routes that cost real CPU (geometry, PDFs, SVG drawings), the
 * public proof page, and the public payment routes (a client's deposit checkout, the service's webhooks). Middleware counts each matching request per client address and, when signed
 * in, per user, before the route runs.
 */
import { PAYMENT_WEBHOOK_PATH } from '~/lib/payments/webhook-path.ts';
import { PROOF_PAGE_HEADERS } from '~/lib/proofs/proof-page-headers.ts';
import type { RouteBudgetName } from './rate-budgets.ts';

export interface LimitedRoute {
  budget: RouteBudgetName;
  /** False when the route works without MariaDB: it then counts per process while MariaDB is down. */
  needsDatabase: boolean;
  /** Extra headers on its 429 answer. */
  headers?: Readonly<Record<string, string>>;
}

interface Entry extends LimitedRoute {
  method: 'GET' | 'POST';
  path: RegExp;
}

const ID = '[^/]+';
const ENTRIES: readonly Entry[] = [
  { method: 'POST', path: /^\/api\/layout$/, budget: 'layout', needsDatabase: false },
  { method: 'POST', path: /^\/api\/scala$/, budget: 'scala', needsDatabase: false },
  { method: 'POST', path: /^\/api\/export$/, budget: 'export', needsDatabase: false },
  { method: 'GET', path: new RegExp(`^/api/boards/${ID}/export$`), budget: 'board-export', needsDatabase: true },
  { method: 'GET', path: new RegExp(`^/api/boards/${ID}/thumbnail\\.svg$`), budget: 'thumbnail', needsDatabase: true },
  { method: 'GET', path: new RegExp(`^/api/templates/${ID}/label$`), budget: 'template-label', needsDatabase: true },
  { method: 'GET', path: new RegExp(`^/api/templates/${ID}/index-template$`), budget: 'index-template', needsDatabase: true },
  { method: 'GET', path: new RegExp(`^/p/${ID}$`), budget: 'proof-page', needsDatabase: true, headers: PROOF_PAGE_HEADERS },
  { method: 'POST', path: new RegExp(`^/api/p/${ID}/deposit-checkout$`), budget: 'deposit-checkout', needsDatabase: true },
  { method: 'POST', path: new RegExp(`^${PAYMENT_WEBHOOK_PATH}$`), budget: 'payment-webhook', needsDatabase: true },
];

/**
 * The budget a request counts against, or null. The path is matched decoded and without a
 * trailing slash, as the router sees it, so `/api/%6Cayout` or `/api/layout/` count too; HEAD
 * counts as GET.
 */
export function limitedRouteFor(method: string, pathname: string): LimitedRoute | null {
  const verb = method.toUpperCase() === 'HEAD' ? 'GET' : method.toUpperCase();
  let path: string;
  try {
    path = decodeURIComponent(pathname);
  } catch {
    path = pathname;
  }
  if (path.length > 1) path = path.replace(/\/+$/, '');
  const entry = ENTRIES.find((e) => e.method === verb && e.path.test(path));
  if (!entry) return null;
  const { method: _method, path: _path, ...route } = entry;
  return route;
}
