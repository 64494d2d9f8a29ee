/**
 * The server cross-check: shortly after the design settles, POST /api/layout computes the same
 * layout on the server. The server is the authority: if its numbers differ from the preview, the
 * editor shows the server's layout and says so.
 */
import { useEffect, useState } from 'react';
import type { Layout } from '~/lib/geometry/layout';
import type { Design } from '~/lib/schemas/design';
import { compareLayouts } from './layout-comparison';

/** Wait after the last change before asking the server, in milliseconds. */
export const SERVER_CHECK_DELAY_MS = 400;

export type ServerCheck =
  | { state: 'waiting' }
  | { state: 'match' }
  /** The server's numbers differ; `layout` is the server's, to be shown instead of the preview. */
  | { state: 'mismatch'; layout: Layout | null; detail: string }
  | { state: 'unavailable'; detail: string };

export function useServerCheck(design: Design | null, preview: Layout | null): ServerCheck {
  const [check, setCheck] = useState<ServerCheck>({ state: 'waiting' });

  useEffect(() => {
    if (!design || !preview) return;
    setCheck({ state: 'waiting' });
    const abort = new AbortController();
    const timer = setTimeout(() => {
      askServer(design, preview, abort.signal).then(
        (result) => setCheck(result),
        (error: unknown) => {
          if (!abort.signal.aborted) setCheck({ state: 'unavailable', detail: String(error) });
        },
      );
    }, SERVER_CHECK_DELAY_MS);
    return () => {
      clearTimeout(timer);
      abort.abort();
    };
  }, [design, preview]);

  return check;
}

async function askServer(design: Design, preview: Layout, signal: AbortSignal): Promise<ServerCheck> {
  const response = await fetch('/api/layout', {
    method: 'POST',
    headers: { 'content-type': 'application/json', accept: 'application/json' },
    body: JSON.stringify(design),
    signal,
  });
  const body: unknown = await response.json();
  if (!response.ok) {
    return { state: 'mismatch', layout: null, detail: `the server refused this design (${serverMessage(body)})` };
  }
  // Compare with the preview as it travels (JSON), as the server's layout did.
  const comparison = compareLayouts(JSON.parse(JSON.stringify(preview)), body);
  switch (comparison.kind) {
    case 'same':
      return { state: 'match' };
    case 'numbers-differ':
      // Same shape as the preview, checked field by field above, so it is a Layout.
      return {
        state: 'mismatch',
        layout: body as Layout,
        detail: `${comparison.path}: preview ${comparison.preview}, server ${comparison.server}`,
      };
    case 'shape-differs':
      return { state: 'mismatch', layout: null, detail: `the server's layout differs at ${comparison.path}` };
  }
}

function serverMessage(body: unknown): string {
  if (typeof body === 'object' && body !== null && 'error' in body) return String(body.error);
  return 'no reason given';
}
