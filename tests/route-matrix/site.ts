/** The app shell's pages and the public service endpoints. */
import type { RouteCase } from './types.ts';

const everyone = (status: number) => ({ anonymous: status, client: status, builder: status, owner: status, otherOwner: status });
/** Pages for Owners and Builders: visitors are sent to sign in, Clients get 403. */
const designers = { anonymous: 302, client: 403, builder: 200, owner: 200, otherOwner: 200 };

export const SITE_ROUTES: readonly RouteCase[] = [
  { file: 'pages/index.astro', method: 'GET', path: '/', expect: everyone(200) },
  { file: 'pages/404.astro', method: 'GET', path: '/no-such-page', expect: everyone(404) },
  { file: 'pages/safety.astro', method: 'GET', path: '/safety', expect: everyone(200) },
  { file: 'pages/measuring.astro', method: 'GET', path: '/measuring', expect: everyone(200) },
  { file: 'pages/layout.astro', method: 'GET', path: '/layout', expect: everyone(200) },
  { file: 'pages/boards.astro', method: 'GET', path: '/boards', expect: designers },
  { file: 'pages/templates.astro', method: 'GET', path: '/templates', expect: designers },
  { file: 'pages/shared.astro', method: 'GET', path: '/shared', expect: { ...everyone(200), anonymous: 302 } },
  { file: 'pages/api/health.ts', method: 'GET', path: '/api/health', expect: everyone(200) },
  { file: 'pages/api/version.ts', method: 'GET', path: '/api/version', expect: everyone(200) },
  {
    file: 'pages/api/layout.ts',
    method: 'POST',
    path: '/api/layout',
    body: {
      name: 'Matrix check',
      units: 'mm',
      strings: 6,
      scale: { treble: 650, bass: 650 },
      perpendicularFret: 0,
      frets: 19,
      stringSpacing: { nut: 43, bridge: 58 },
      temperament: { kind: 'equal', divisions: 12 },
      overhang: { nut: 4.5, end: 5 },
      endExtension: 10,
      slot: { width: 0.55 },
      compensation: { saddleTreble: 1.5, saddleBass: 3 },
      markers: [],
    },
    expect: everyone(200),
  },
  {
    file: 'pages/api/scala.ts',
    method: 'POST',
    path: '/api/scala',
    contentType: 'text/plain',
    body: '! matrix.scl\nTwelve equal\n12\n!\n100.0\n200.0\n300.0\n400.0\n500.0\n600.0\n700.0\n800.0\n900.0\n1000.0\n1100.0\n2/1\n',
    expect: everyone(200),
  },
];
