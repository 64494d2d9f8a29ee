/**
 * Astro Actions (astro:actions): the account and member forms. Each is a plain HTML form posted
 * to its page (`action={actions.members.invite}`), so it works without JavaScript; middleware
 * checks its Origin (CSRF) and its size like any other form post, and the page renders the outcome.
 */
import { account } from './account.ts';
import { members } from './members.ts';

export const server = { account, members };
