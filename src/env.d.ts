/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in user, resolved by middleware; null for visitors. */
    user: import('~/lib/auth/session-user.ts').SessionUser | null;
    sessionId: string | null;
  }
}
