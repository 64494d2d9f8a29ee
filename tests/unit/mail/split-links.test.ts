import { describe, expect, it } from 'vitest';
import { splitLinks } from '~/lib/mail/split-links.ts';

describe('splitLinks (Outbox page)', () => {
  it('separates links from the text around them and keeps every character', () => {
    const text = 'Open this:\nhttp://127.0.0.1:4321/invitations/abc_DEF-123\nthanks';
    const parts = splitLinks(text);
    expect(parts.filter((p) => p.link).map((p) => p.text)).toEqual(['http://127.0.0.1:4321/invitations/abc_DEF-123']);
    expect(parts.map((p) => p.text).join('')).toBe(text);
  });

  it('returns plain text untouched', () => {
    expect(splitLinks('no links here')).toEqual([{ text: 'no links here', link: false }]);
  });
});
