import type { APIRoute } from 'astro';
import { handleScalaRequest } from '~/lib/geometry-api/scala-endpoint.server.ts';

export const prerender = false;

export const POST: APIRoute = ({ request }) => handleScalaRequest(request);
