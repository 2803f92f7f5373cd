/**
 * The preview page's HTML: a small shell with the embedded data (JSON), the worker bundle (as text, started
 * from a Blob URL) and the page bundle inlined. Pure string work; the page script builds the rest.
 */
import type { Embedded } from './protocol.js';

function escapeText(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/**
 * Script text made safe inside <script>…</script>: a "</script" or "<!--" in the code (always inside a string
 * or regular expression in bundled code) gets an escaped slash or bang, which JavaScript reads the same.
 */
function scriptSafe(js: string): string {
  return js.replace(/<\/(script)/gi, '<\\/$1').replace(/<!--/g, '<\\!--');
}

/** JSON safe inside <script type="application/json">: every "<" escaped. */
function jsonSafe(value: unknown): string {
  return JSON.stringify(value).replace(/</g, '\\u003c');
}

export function pageHtml(p: { title: string; data: Embedded; worker: string; page: string }): string {
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="rhoform preview">
<title>${escapeText(p.title)}</title>
</head><body>
<noscript>This page needs JavaScript: it runs rhoform in the browser.</noscript>
<script type="application/json" id="rhoform-data">${jsonSafe(p.data)}</script>
<script type="text/plain" id="rhoform-worker">${scriptSafe(p.worker)}</script>
<script>${scriptSafe(p.page)}</script>
</body></html>
`;
}
