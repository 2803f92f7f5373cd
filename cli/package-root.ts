/** The package's root folder (where package.json is), from the sources (cli/) or the compiled dist/cli/. */
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));

export function packageRoot(): string {
  for (const up of ['..', '../..']) {
    const root = resolve(here, up);
    if (existsSync(join(root, 'package.json'))) return root;
  }
  return resolve(here, '..');
}
