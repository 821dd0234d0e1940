/** A run of plain text or a web address inside it. */
export type TextSegment = { kind: "text"; text: string } | { kind: "link"; href: string };

// http(s) addresses up to the next whitespace or closing bracket/quote; trailing punctuation is not part of them.
const urlPattern = /https?:\/\/[^\s<>"')\]]+/g;
const trailingPunctuation = /[.,;:!?]+$/;

/**
 * Splits plain text (an e-mail body) into text and http(s) links, so a page can make links clickable
 * without rendering any HTML from the message.
 * @param text - plain text
 */
export function linkSegments(text: string): TextSegment[] {
  const segments: TextSegment[] = [];
  let cursor = 0;
  for (const match of text.matchAll(urlPattern)) {
    const start = match.index;
    const href = match[0].replace(trailingPunctuation, "");
    if (start > cursor) segments.push({ kind: "text", text: text.slice(cursor, start) });
    segments.push({ kind: "link", href });
    cursor = start + href.length;
  }
  if (cursor < text.length) segments.push({ kind: "text", text: text.slice(cursor) });
  return segments;
}
