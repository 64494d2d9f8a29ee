import { problem } from './problem.ts';

/** 405 naming the one method a route takes (its `ALL` export answers the others with this). */
export function methodNotAllowed(allow: 'POST', how: string): Response {
  return problem(405, how, {}, { allow });
}
