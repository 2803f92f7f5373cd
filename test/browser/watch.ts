/**
 * What a page did while it loaded: console errors, uncaught script errors, every request (and the failed
 * ones), web sockets. Network schemes are refused at the context, so nothing leaves the machine even when
 * a page asks.
 */
import type { BrowserContext, Page } from 'playwright-core';

export interface PageLog {
  readonly consoleErrors: string[];
  readonly pageErrors: string[];
  /** URL of every request the context saw, data: URLs included. */
  readonly requests: string[];
  readonly failed: string[];
  readonly sockets: string[];
}

/** Records what pages of `context` do from now on, and refuses http(s), ws(s) and ftp requests. */
export async function watchContext(context: BrowserContext): Promise<PageLog> {
  const log: PageLog = { consoleErrors: [], pageErrors: [], requests: [], failed: [], sockets: [] };
  context.on('request', (r) => log.requests.push(r.url()));
  context.on('requestfailed', (r) => log.failed.push(`${r.url()}: ${r.failure()?.errorText ?? '?'}`));
  await context.route(/^(https?|wss?|ftp):/i, (route) => route.abort('blockedbyclient'));
  const onPage = (page: Page) => {
    page.on('console', (m) => {
      if (m.type() === 'error') log.consoleErrors.push(`${m.text()} @ ${m.location().url}:${m.location().lineNumber}`);
    });
    page.on('pageerror', (err) => log.pageErrors.push(String(err)));
    page.on('websocket', (ws) => log.sockets.push(ws.url()));
  };
  context.on('page', onPage);
  for (const p of context.pages()) onPage(p);
  return log;
}
