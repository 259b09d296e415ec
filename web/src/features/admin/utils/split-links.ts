export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; href: string };

// Web addresses in a plain-text mail body; trailing punctuation belongs to the sentence.
const URL_PATTERN = /https?:\/\/[^\s<>"]+[^\s<>".,;:!?)\]]/g;

/** Splits a plain-text body into text and http(s) links, so the links can be made clickable. */
export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    if (match.index > last) parts.push({ kind: 'text', text: text.slice(last, match.index) });
    parts.push({ kind: 'link', href: match[0] });
    last = match.index + match[0].length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}
