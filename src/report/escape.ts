/** Escaping of text for HTML (and inline SVG) text content and double- or single-quoted attribute values. */

const ENTITIES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Escapes `&`, `<`, `>`, `"` and `'` (HTML Living Standard §13.1.2.6 / XML 1.0 §2.4) and replaces C0 control
 * characters other than tab, LF and CR, and lone surrogates, with U+FFFD, so any string (a file name, a
 * message) is safe as text or as a quoted attribute value.
 */
export function escapeHtml(s: string): string {
  return s
    .replace(/[&<>"']/g, (c) => ENTITIES[c] ?? c)
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD');
}
