import type { APIRoute } from 'astro';
import { readRoute, retireRoute, updateRoute } from '~/lib/templates/shelf-endpoints.server.ts';

export const prerender = false;

export const GET: APIRoute = ({ locals, params }) => readRoute(locals.user, params.id);
export const PATCH: APIRoute = ({ locals, params, request }) => updateRoute(locals.user, params.id, request);
export const DELETE: APIRoute = ({ locals, params }) => retireRoute(locals.user, params.id);
