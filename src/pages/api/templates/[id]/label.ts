import type { APIRoute } from 'astro';
import { labelRoute } from '~/lib/templates/export-endpoints.server.ts';

export const prerender = false;

export const GET: APIRoute = ({ locals, params, url, request }) => labelRoute(locals.user, params.id, url, request.signal);
