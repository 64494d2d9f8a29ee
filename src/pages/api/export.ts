import type { APIRoute } from 'astro';
import { handleExportRequest } from '~/lib/export/export-endpoint.server.ts';

export const prerender = false;

export const POST: APIRoute = ({ request, locals }) => handleExportRequest(request, undefined, locals.user);
