/**
 * Where the browser tests find Chromium, and what they do when it is missing: Debian's `chromium` package
 * at /usr/bin/chromium unless `RHOFORM_CHROMIUM` names another executable. Locally a missing browser skips
 * the browser tests with a message; under CI (env `CI` non-empty) it fails them, so CI cannot skip silently.
 */
import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';

/** Debian's Chromium (apt-get install -y chromium). */
export const DEFAULT_CHROMIUM = '/usr/bin/chromium';

/** The executable the browser tests launch. */
export const chromiumPath: string = process.env.RHOFORM_CHROMIUM || DEFAULT_CHROMIUM;

/** True when running under CI, where a missing Chromium is a failure, not a skip. */
export const underCi: boolean = (process.env.CI ?? '') !== '';

/** True when the executable exists. */
export const chromiumFound: boolean = existsSync(chromiumPath);

/** Why the browser tests cannot run here. */
export const missingMessage =
  `Chromium not found at ${chromiumPath}` +
  (process.env.RHOFORM_CHROMIUM ? ' (from RHOFORM_CHROMIUM)' : '') +
  ' — install Debian package chromium (apt-get install -y chromium) or point RHOFORM_CHROMIUM at a Chromium executable';

/**
 * Headless Chromium with nothing that reaches out on its own (no background networking, component updates,
 * sync or QUIC), so any request seen during a test came from the page itself. `--no-sandbox` because CI
 * containers run as root; `--disable-gpu` because they have no GPU.
 */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: chromiumPath,
    timeout: 45_000,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}
