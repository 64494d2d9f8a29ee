import type { RouteCase } from './types.ts';

/** The Layout editor is open to everyone: visitors work on a scratch design in their browser. */
export const LAYOUT_ROUTES: readonly RouteCase[] = [
  {
    file: 'pages/layout.astro',
    method: 'GET',
    path: '/layout',
    expect: { anonymous: 200, client: 200, builder: 200, owner: 200, otherOwner: 200 },
  },
];
