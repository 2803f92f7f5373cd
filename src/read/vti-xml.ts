/**
 * A small XML reader for the subset VTK XML files use (W3C XML 1.0, 5th ed., 2008, restricted): elements with
 * attributes in single or double quotes, text, comments, processing instructions and the XML declaration; no
 * DTD, no entities other than the five predefined ones, no CDATA. Enough to read `.vti` files; anything outside
 * the subset is an E_VTI_XML error with its line and column.
 */
import { RhoformError, type Where } from '../errors.js';

export interface XmlElement {
  readonly name: string;
  readonly attrs: Readonly<Record<string, string>>;
  readonly children: XmlElement[];
  /** Offset of '<' of the start tag. */
  readonly start: number;
  /** Text between the start tag and the first child or end tag: [from, to) offsets. */
  textFrom: number;
  textTo: number;
}

const ENTITIES: Record<string, string> = { lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" };

function unescape(s: string): string {
  return s.includes('&') ? s.replace(/&(lt|gt|amp|quot|apos);/g, (_m, e: string) => ENTITIES[e]) : s;
}

/**
 * Parses `text` (one char per byte) up to `stop` into the root element. `stopTag`: the name of an element whose
 * content is not XML (VTK's AppendedData); parsing ends at its start tag, which is returned with the offset
 * after '>'.
 */
export function parseXml(text: string, where: (offset: number) => Where, stopTag: string): { root: XmlElement; stopAt: number | null } {
  const fail = (what: string, at: number): never => {
    const found = at >= text.length ? 'the end of the file' : JSON.stringify(text.slice(at, at + 20));
    throw new RhoformError('E_VTI_XML', `expected ${what}, found ${found}`, where(at));
  };
  const stack: XmlElement[] = [];
  let root: XmlElement | null = null;
  let k = 0;
  const n = text.length;
  const nameRe = /[A-Za-z_:][-A-Za-z0-9_:.]*/y;
  const attrRe = /\s+([A-Za-z_:][-A-Za-z0-9_:.]*)\s*=\s*(?:"([^"<]*)"|'([^'<]*)')/y;
  while (k < n) {
    const lt = text.indexOf('<', k);
    if (lt < 0) {
      if (stack.length > 0 || text.slice(k).trim() !== '') fail(`</${stack[stack.length - 1]?.name ?? ''}>`, n);
      break;
    }
    if (stack.length === 0 && text.slice(k, lt).trim() !== '' && !(k === 0 && text.charCodeAt(0) === 0xfeff)) fail('an element', k);
    if (text.startsWith('<?', lt)) {
      const e = text.indexOf('?>', lt);
      if (e < 0) fail("'?>'", n);
      k = e + 2;
      continue;
    }
    if (text.startsWith('<!--', lt)) {
      const e = text.indexOf('-->', lt);
      if (e < 0) fail("'-->'", n);
      k = e + 3;
      continue;
    }
    if (text.startsWith('<!', lt)) fail('an element (DTDs and CDATA are not read)', lt);
    const top = stack[stack.length - 1];
    if (top && top.children.length === 0 && top.textTo < 0) top.textTo = lt;
    if (text.startsWith('</', lt)) {
      nameRe.lastIndex = lt + 2;
      const m = nameRe.exec(text);
      if (!m || !top || m[0] !== top.name) fail(top ? `</${top.name}>` : 'no end tag', lt);
      const gt = text.indexOf('>', lt);
      if (gt < 0 || text.slice(lt + 2 + (m as RegExpExecArray)[0].length, gt).trim() !== '') fail("'>'", lt);
      stack.pop();
      k = gt + 1;
      continue;
    }
    nameRe.lastIndex = lt + 1;
    const m = nameRe.exec(text);
    if (!m) fail('an element name', lt + 1);
    const name = (m as RegExpExecArray)[0];
    const attrs: Record<string, string> = {};
    let p = lt + 1 + name.length;
    for (;;) {
      attrRe.lastIndex = p;
      const a = attrRe.exec(text);
      if (!a) break;
      if (a[1] in attrs) fail(`each attribute once in <${name}>`, p);
      attrs[a[1]] = unescape(a[2] ?? a[3]);
      p = attrRe.lastIndex;
    }
    while (p < n && /\s/.test(text[p])) p++;
    const selfClose = text.startsWith('/>', p);
    if (!selfClose && text[p] !== '>') fail(`an attribute or '>' in <${name}>`, p);
    const end = p + (selfClose ? 2 : 1);
    const el: XmlElement = { name, attrs, children: [], start: lt, textFrom: end, textTo: selfClose ? end : -1 };
    if (top) {
      top.children.push(el);
    } else if (root) fail('one root element', lt);
    else root = el;
    if (name === stopTag && !selfClose) return { root: root as XmlElement, stopAt: end };
    if (!selfClose) stack.push(el);
    k = end;
  }
  if (!root) fail('a root element', 0);
  return { root: root as XmlElement, stopAt: null };
}

/** The first child named `name`, or undefined. */
export function child(el: XmlElement, name: string): XmlElement | undefined {
  return el.children.find((c) => c.name === name);
}
