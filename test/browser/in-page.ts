/**
 * Functions that run inside the browser (handed to Playwright's `page.evaluate`, which sends their source
 * text): each is self-contained, touches only the DOM, and returns plain JSON. The project compiles without
 * the DOM library, so the few DOM members used are typed here.
 */

interface Rect {
  readonly width: number;
  readonly height: number;
}
interface El {
  readonly id: string;
  readonly tagName: string;
  readonly textContent: string | null;
  readonly innerText: string;
  readonly children: ArrayLike<El>;
  getAttribute(name: string): string | null;
  querySelector(sel: string): El | null;
  querySelectorAll(sel: string): ArrayLike<El>;
  getBoundingClientRect(): Rect;
  getBBox(): Rect;
}
interface Img {
  src: string;
  readonly naturalWidth: number;
  readonly naturalHeight: number;
  decode(): Promise<void>;
}
interface Ctx2d {
  drawImage(img: Img, x: number, y: number): void;
  getImageData(x: number, y: number, w: number, h: number): { readonly data: ArrayLike<number> };
}
interface Canvas {
  width: number;
  height: number;
  getContext(kind: '2d', opts: { willReadFrequently: boolean }): Ctx2d | null;
}
interface Win {
  readonly document: {
    getElementById(id: string): El | null;
    querySelectorAll(sel: string): ArrayLike<El>;
    createElement(tag: 'canvas'): Canvas;
    readonly documentElement: { readonly scrollWidth: number; readonly scrollHeight: number };
  };
  readonly Image: new () => Img;
}

export interface FigureFacts {
  readonly id: string;
  /** On-screen size of the figure's first <svg>, CSS px (0 × 0 when missing). */
  readonly svg: Rect;
  /** Size of the drawing inside that <svg> (getBBox of its content), user units. */
  readonly content: Rect;
  /** Each raster <image> of the figure: its href and on-screen size. */
  readonly images: { readonly href: string; readonly width: number; readonly height: number }[];
  /** `data-n` and status class of each numbered finding marker, in document order. */
  readonly markers: { readonly n: number; readonly status: string }[];
  /** href of each link of the figure, and whether the page holds an element with that fragment id. */
  readonly links: { readonly href: string; readonly resolves: boolean }[];
  /** getBBox of each <use> of the figure (0 × 0 when its reference does not resolve). */
  readonly uses: Rect[];
}

export interface PageFacts {
  /** null for a figure id the page lacks. */
  readonly figures: Record<string, FigureFacts | null>;
  /** Rows of the checks table: row class, the text of each cell, and whether the row takes room on screen. */
  readonly checks: { readonly cls: string; readonly cells: string[]; readonly shown: boolean }[];
  /** Rows of the findings table: row id, row class, the text of each cell, and whether it is on screen. */
  readonly findings: { readonly id: string; readonly cls: string; readonly cells: string[]; readonly shown: boolean }[];
}

/** What the browser made of the page: figure sizes and references, and the text of both tables. */
export function readPage(ids: readonly string[]): PageFacts {
  const doc = (globalThis as unknown as Win).document;
  const size = (r: Rect): Rect => ({ width: r.width, height: r.height });
  const figures: Record<string, FigureFacts | null> = {};
  for (const id of ids) {
    const fig = doc.getElementById(id);
    if (fig === null) {
      figures[id] = null;
      continue;
    }
    const svg = fig.querySelector('svg');
    figures[id] = {
      id,
      svg: svg ? size(svg.getBoundingClientRect()) : { width: 0, height: 0 },
      content: svg ? size(svg.getBBox()) : { width: 0, height: 0 },
      images: Array.from(fig.querySelectorAll('image')).map((im) => {
        const r = im.getBoundingClientRect();
        return { href: im.getAttribute('href') ?? '', width: r.width, height: r.height };
      }),
      markers: Array.from(fig.querySelectorAll('g.mk')).map((g) => ({
        n: Number(g.getAttribute('data-n')),
        status: (g.getAttribute('class') ?? '').replace('mk', '').trim(),
      })),
      links: Array.from(fig.querySelectorAll('a')).map((a) => {
        const href = a.getAttribute('href') ?? '';
        return { href, resolves: href.startsWith('#') && doc.getElementById(href.slice(1)) !== null };
      }),
      uses: Array.from(fig.querySelectorAll('use')).map((u) => size(u.getBBox())),
    };
  }
  const cellsOf = (tr: El): string[] => Array.from(tr.children).map((td) => td.innerText.trim());
  const shown = (tr: El): boolean => {
    const r = tr.getBoundingClientRect();
    return r.width > 0 && r.height > 0;
  };
  return {
    figures,
    checks: Array.from(doc.querySelectorAll('table.checks > tbody > tr')).map((tr) => ({
      cls: tr.getAttribute('class') ?? '',
      cells: cellsOf(tr),
      shown: shown(tr),
    })),
    findings: Array.from(doc.querySelectorAll('table.findings > tbody > tr')).map((tr) => ({
      id: tr.id,
      cls: tr.getAttribute('class') ?? '',
      cells: cellsOf(tr),
      shown: shown(tr),
    })),
  };
}

export interface PixelFacts {
  readonly width: number;
  readonly height: number;
  /** Distinct RGBA colours (counting stops at 4096). */
  readonly colours: number;
  /** Share of pixels that are not near-white (any channel below 240). */
  readonly inked: number;
}

/**
 * Decodes an image URL with the browser's own decoder and measures its pixels. Rejects when the browser
 * cannot decode it.
 */
export async function decodePixels(url: string): Promise<PixelFacts> {
  const w = globalThis as unknown as Win;
  const img = new w.Image();
  img.src = url;
  await img.decode();
  const canvas = w.document.createElement('canvas');
  canvas.width = img.naturalWidth;
  canvas.height = img.naturalHeight;
  const ctx = canvas.getContext('2d', { willReadFrequently: true });
  if (ctx === null) throw new Error('no 2d canvas context');
  ctx.drawImage(img, 0, 0);
  const d = ctx.getImageData(0, 0, canvas.width, canvas.height).data;
  const seen = new Set<number>();
  let inked = 0;
  for (let k = 0; k < d.length; k += 4) {
    if (seen.size < 4096) seen.add(((d[k] << 24) | (d[k + 1] << 16) | (d[k + 2] << 8) | d[k + 3]) >>> 0);
    if (d[k] < 240 || d[k + 1] < 240 || d[k + 2] < 240) inked++;
  }
  return { width: img.naturalWidth, height: img.naturalHeight, colours: seen.size, inked: inked / Math.max(1, d.length / 4) };
}

/**
 * Share of pixels that differ (any channel by more than 8) between two same-size images, decoded by the
 * browser; 1 when the sizes differ.
 */
export async function changedShare(urls: readonly [string, string]): Promise<number> {
  const w = globalThis as unknown as Win;
  const data: ArrayLike<number>[] = [];
  const sizes: string[] = [];
  for (const url of urls) {
    const img = new w.Image();
    img.src = url;
    await img.decode();
    const canvas = w.document.createElement('canvas');
    canvas.width = img.naturalWidth;
    canvas.height = img.naturalHeight;
    const ctx = canvas.getContext('2d', { willReadFrequently: true });
    if (ctx === null) throw new Error('no 2d canvas context');
    ctx.drawImage(img, 0, 0);
    data.push(ctx.getImageData(0, 0, canvas.width, canvas.height).data);
    sizes.push(`${img.naturalWidth}x${img.naturalHeight}`);
  }
  if (sizes[0] !== sizes[1]) return 1;
  const [a, b] = data;
  let changed = 0;
  for (let k = 0; k < a.length; k += 4) {
    if (Math.abs(a[k] - b[k]) > 8 || Math.abs(a[k + 1] - b[k + 1]) > 8 || Math.abs(a[k + 2] - b[k + 2]) > 8) changed++;
  }
  return changed / Math.max(1, a.length / 4);
}

/** Hides (true) or shows again (false) every raster <image> of the figure with this id. */
export function hideRasters([id, hide]: readonly [string, boolean]): number {
  const doc = (globalThis as unknown as Win).document;
  const images = Array.from(doc.getElementById(id)?.querySelectorAll('image') ?? []) as unknown as { style: { visibility: string } }[];
  for (const im of images) im.style.visibility = hide ? 'hidden' : '';
  return images.length;
}
