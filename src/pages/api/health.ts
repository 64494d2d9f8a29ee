import type { APIRoute } from 'astro';
import { databaseAnswers } from '~/lib/db/health.server.ts';
import { json } from '~/lib/http/problem.ts';

export const prerender = false;

/** Public liveness: 200 when MariaDB answers, 503 within 2 s when it does not. */
export const GET: APIRoute = async () => {
  const up = await databaseAnswers(1500);
  return json({ status: up ? 'ok' : 'degraded', db: up ? 'ok' : 'down' }, up ? 200 : 503);
};
