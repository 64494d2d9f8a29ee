/** The fret wire a design names, from the signed-in member's own shop list (never another shop's). */
import { CAN, hasRole, type SessionUser } from '~/lib/auth/index.server.ts';
import { db } from '~/lib/db/client.server.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';
import { getWire } from './fret-wires.server.ts';

/** Null when none is named, the id is not on the shop's list, or the user is not a shop member who may see it. */
export async function boardWire(user: SessionUser | null | undefined, design: Design): Promise<FretWire | null> {
  if (design.wire.id === 0 || !hasRole(user, CAN.design)) return null;
  return getWire(db(), user.shopId, design.wire.id);
}
