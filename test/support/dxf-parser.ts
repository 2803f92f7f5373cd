/**
 * dxf-parser 1.1.2 (an independent DXF reader, MIT, github.com/gdsestimating/dxf-parser) for the tests that read
 * our DXF back. It ships a CommonJS bundle; under NodeNext the default import may be the module object.
 */
import DxfParserModule from 'dxf-parser';
import type { IDxf } from 'dxf-parser';

type ParserClass = new () => { parseSync(text: string): IDxf | null };

/** The parser class itself. */
export const DxfParser: ParserClass =
  (DxfParserModule as unknown as { default?: ParserClass }).default ?? (DxfParserModule as unknown as ParserClass);

/** Parse DXF text with dxf-parser; throws when it returns nothing. */
export function parseDxf(text: string): IDxf {
  const dxf = new DxfParser().parseSync(text);
  if (!dxf) throw new Error('dxf-parser returned nothing');
  return dxf;
}
