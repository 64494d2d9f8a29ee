import type { APIRoute } from 'astro';
import { handleExportRequest } from '~/lib/export/export-endpoint.server';

export const prerender = false;

export const POST: APIRoute = ({ request }) => handleExportRequest(request);
