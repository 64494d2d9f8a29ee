/** Splits plain text into text and web-link parts, so a page can make the links clickable. */
export interface TextPart {
  text: string;
  link: boolean;
}

const LINK = /https?:\/\/[^\s<>"']+/g;

export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(LINK)) {
    if (match.index > last) parts.push({ text: text.slice(last, match.index), link: false });
    parts.push({ text: match[0], link: true });
    last = match.index + match[0].length;
  }
  if (last < text.length) parts.push({ text: text.slice(last), link: false });
  return parts;
}
