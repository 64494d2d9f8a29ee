import type { APIRoute } from 'astro';
import { listChecksRoute, postCheckRoute } from '~/lib/templates/check-endpoints.server.ts';

export const prerender = false;

export const GET: APIRoute = ({ locals, params }) => listChecksRoute(locals.user, params.id);
export const POST: APIRoute = ({ locals, params, request }) => postCheckRoute(locals.user, params.id, request);
