/**
 * Text values for DXF TEXT entities.
 *
 * A value must stay on one line and be at most 255 characters long (DXF Reference, group code value types),
 * so control characters become spaces and the text is cut at 250 characters. The file declares
 * `$DWGCODEPAGE` ANSI_1252; every character outside printable ASCII is written as `\U+XXXX` (one per UTF-16
 * unit), the escape AutoCAD and ezdxf decode in R2000 text values (from memory; ezdxf's reader decodes it).
 * Characters a reader might take as the start of a control sequence — `\` and `^` (caret-encoded control
 * characters), and `%` next to another `%` (`%%d`, `%%u` control codes) — are escaped the same way, so a label
 * always reads back literally (ezdxf's writer uses the same `\U+XXXX` form for characters outside the code page).
 */
export function dxfText(value: string): string {
  let out = '';
  for (let i = 0; i < value.length && out.length < 250; i++) {
    const code = value.charCodeAt(i);
    if (code < 0x20 || code === 0x7f) out += ' ';
    else if (code > 0x7e || code === 0x5c || code === 0x5e || (code === 0x25 && nextToPercent(value, i))) {
      out += `\\U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
    } else out += value[i];
  }
  return out;
}

const nextToPercent = (value: string, i: number): boolean => value[i - 1] === '%' || value[i + 1] === '%';
