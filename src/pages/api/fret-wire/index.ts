import type { APIRoute } from 'astro';
import { createRoute, listRoute } from '~/lib/wire/wire-endpoints.server.ts';

export const prerender = false;

export const GET: APIRoute = ({ locals }) => listRoute(locals.user);
export const POST: APIRoute = ({ locals, request }) => createRoute(locals.user, request);
