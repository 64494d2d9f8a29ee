import type { APIRoute } from 'astro';
import { json } from '~/lib/http/problem.ts';
import pkg from '../../../package.json';

export const prerender = false;

/** Public, constant: the app name and version (also the baseline for throughput benches). */
export const GET: APIRoute = () => json({ name: 'kerfline', version: pkg.version });
