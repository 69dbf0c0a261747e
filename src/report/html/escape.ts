/**
 * Escaping of text placed in HTML or SVG (element content and double-quoted attribute values).
 * Station ids, file names and evidence come from input files and may hold `<`, `&` or quotes.
 */

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Escape `& < > " '` as character references (HTML Living Standard §13.1.4, XML 1.0 §4.1), so the text is
 * safe as element content and inside quoted attribute values of both HTML and SVG.
 * @example escapeXml('a<b & "c"') // 'a&lt;b &amp; &quot;c&quot;'
 */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}
