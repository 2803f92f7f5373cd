/** XML escaping for SVG text content and attribute values (XML 1.0 §2.4 and §3.3.3). */

const ENTITIES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' };

/**
 * Escapes `&`, `<`, `>`, `"` and `'`, and replaces characters XML 1.0 forbids (C0 controls other than tab,
 * LF and CR, lone surrogates, U+FFFE/U+FFFF) with U+FFFD, so any string is safe as text or attribute value.
 */
export function escapeXml(value: string): string {
  return value
    .replace(/[&<>"']/g, (c) => ENTITIES[c] ?? c)
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD');
}
