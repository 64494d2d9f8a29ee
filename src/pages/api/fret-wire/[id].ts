import type { APIRoute } from 'astro';
import { deleteRoute, readRoute, updateRoute } from '~/lib/wire/wire-endpoints.server.ts';

export const prerender = false;

export const GET: APIRoute = ({ locals, params }) => readRoute(locals.user, params.id);
export const PUT: APIRoute = ({ locals, params, request }) => updateRoute(locals.user, params.id, request);
export const DELETE: APIRoute = ({ locals, params }) => deleteRoute(locals.user, params.id);
