import type { APIRoute } from 'astro';
import { handleLayoutRequest } from '~/lib/geometry-api/layout-endpoint.server.ts';

export const prerender = false;

export const POST: APIRoute = ({ request }) => handleLayoutRequest(request);
