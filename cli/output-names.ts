/**
 * The names of the output files of one grid (DESIGN §8, docs/output-formats.md): `<stem>` plus a suffix per
 * format, and the annotations file beside the part's DXF under `--annotations`. Pure (no node: imports), so the
 * preview page names its report's `outputs` exactly as the CLI does.
 */
import type { OutputFormat } from '../src/settings.js';

export const OUTPUT_SUFFIX: Readonly<Record<OutputFormat, string>> = {
  dxf: '.dxf',
  svg: '.svg',
  json: '.report.json',
  html: '.report.html',
  stl: '.stl',
  '3mf': '.3mf',
};

/** The annotations file beside the part's DXF (`--annotations`). */
export const NOTES_SUFFIX = '.notes.dxf';

/** One file to write: its format, its path (`base` + suffix) and whether it is the annotations DXF. */
export interface OutputName {
  readonly format: OutputFormat;
  readonly path: string;
  readonly annotations?: true;
}

/** The files of one grid in the order they are written and listed in the report's `outputs`. */
export function outputNames(base: string, formats: readonly OutputFormat[], annotations: boolean): OutputName[] {
  const names: OutputName[] = formats.map((f) => ({ format: f, path: base + OUTPUT_SUFFIX[f] }));
  if (annotations && formats.includes('dxf')) names.splice(formats.indexOf('dxf') + 1, 0, { format: 'dxf', path: base + NOTES_SUFFIX, annotations: true });
  return names;
}
