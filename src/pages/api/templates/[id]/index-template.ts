import type { APIRoute } from 'astro';
import { indexTemplateRoute } from '~/lib/templates/export-endpoints.server.ts';

export const prerender = false;

export const GET: APIRoute = ({ locals, params, url, request }) => indexTemplateRoute(locals.user, params.id, url, request.signal);
