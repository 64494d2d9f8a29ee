/**
 * The only file that knows the session library (lucia 3, deprecated upstream): swap it here.
 */
import { DrizzleMySQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan } from 'lucia';
import { db } from '~/lib/db/client.server.ts';
import { sessions, users, type Role } from '~/lib/db/schema.ts';
import { config } from '~/lib/config/env.server.ts';

let instance: ReturnType<typeof create> | undefined;

function create() {
  const adapter = new DrizzleMySQLAdapter(db(), sessions, users);
  return new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: {
      name: 'kerfline_session',
      attributes: {
        // Secure whenever the app is served over HTTPS; SameSite=Lax and HttpOnly always.
        secure: config().appOrigin.startsWith('https:'),
        sameSite: 'lax',
      },
    },
    getUserAttributes: (row) => ({
      shopId: row.shopId,
      email: row.email,
      displayName: row.displayName,
      role: row.role,
      preferredUnits: row.preferredUnits,
    }),
  });
}

export function lucia() {
  if (!instance) instance = create();
  return instance;
}

/** Column keys as Drizzle names them (the adapter selects the whole users row). */
interface DatabaseUserAttributes {
  shopId: number;
  email: string;
  displayName: string;
  role: Role;
  preferredUnits: 'mm' | 'in';
}

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof create>;
    DatabaseUserAttributes: DatabaseUserAttributes;
  }
}
