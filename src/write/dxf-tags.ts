/**
 * Low-level DXF tag output: one group code line, one value line (DXF Reference, "About the DXF Format").
 *
 * Group codes are right-justified in three characters as AutoCAD writes them; lines end in CRLF.
 * Tags are collected as "code\r\nvalue" strings and joined once at the end.
 */
import { formatNumber } from './number.js';

/** Line ending of every DXF line (CRLF, as AutoCAD writes; dxf-parser and ezdxf accept LF and CRLF). */
export const EOL = '\r\n';
/** Decimals written for coordinates and lengths (0.000001 output unit). */
export const DXF_DECIMALS = 6;

const codeText = (code: number): string => (code < 10 ? `  ${code}` : code < 100 ? ` ${code}` : `${code}`);

/** An append-only list of DXF tags. */
export class DxfTags {
  readonly parts: string[] = [];

  /** Appends one tag; `value` is written as given (strings) or as a deterministic decimal (numbers). */
  tag(code: number, value: string | number): this {
    const text = typeof value === 'number' ? formatNumber(value, DXF_DECIMALS) : value;
    this.parts.push(`${codeText(code)}${EOL}${text}`);
    return this;
  }

  /** Appends an integer tag (flags, counts, colours), written without decimals. */
  int(code: number, value: number): this {
    this.parts.push(`${codeText(code)}${EOL}${Math.trunc(value)}`);
    return this;
  }

  /** Appends a point as 10/20/30-style tags (x at `code`, y at code + 10, z = 0 at code + 20). */
  point(code: number, x: number, y: number): this {
    return this.tag(code, x).tag(code + 10, y).tag(code + 20, 0);
  }

  /** The whole text, every line terminated by EOL. */
  text(): string {
    return this.parts.join(EOL) + EOL;
  }
}

/** Formats a handle as upper-case hexadecimal without leading zeros (group codes 5, 105, 330, 340, 350). */
export const hex = (handle: number): string => handle.toString(16).toUpperCase();
