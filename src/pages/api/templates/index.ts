import type { APIRoute } from 'astro';
import { createRoute, listRoute } from '~/lib/templates/shelf-endpoints.server.ts';

export const prerender = false;

export const GET: APIRoute = ({ locals, url }) => listRoute(locals.user, url);
export const POST: APIRoute = ({ locals, request }) => createRoute(locals.user, request);
