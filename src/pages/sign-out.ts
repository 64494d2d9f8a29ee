import type { APIRoute } from 'astro';
import { endAllSessions, SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { problem } from '~/lib/http/problem.ts';

export const prerender = false;

/** Signs out on every device (the header's "Sign out" button posts here). */
export const POST: APIRoute = async ({ locals, cookies, redirect }) => {
  if (locals.user) await endAllSessions(cookies, locals.user.id);
  else cookies.delete(SESSION_COOKIE, { path: '/' });
  return redirect('/sign-in?notice=signed-out', 303);
};

export const GET: APIRoute = () => problem(405, 'Sign out with the "Sign out" button (POST)', {}, { allow: 'POST' });
