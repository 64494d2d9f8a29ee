/** The signed-in user as every page and route sees it (browser-safe: no secrets). */
import type { Role } from '~/lib/db/schema.ts';

export interface SessionUser {
  id: string;
  shopId: number;
  email: string;
  displayName: string;
  role: Role;
  preferredUnits: 'mm' | 'in';
}

/** Who may do what. Owners can do everything builders can. */
export const CAN = {
  design: ['owner', 'builder'],
  manageMembers: ['owner'],
  viewProofs: ['owner', 'builder', 'client'],
  /** Refunding money and the shop's payment settings (its default currency). */
  refund: ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export function hasRole(user: SessionUser | null | undefined, allowed: readonly Role[]): user is SessionUser {
  return !!user && allowed.includes(user.role);
}
