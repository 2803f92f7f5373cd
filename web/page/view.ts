/**
 * The plan view of the preview page in report-frame millimetres (y up, origin at the lower-left corner of the
 * grid) with layers — density, local thickness, the stress figure of the structural re-check, outline (and the
 * outline before repair and the material repair changed), passive regions, numbered findings — pan (drag), zoom
 * (wheel, about the cursor), fit, a scale bar, and the cursor's coordinates with the grid cell under it.
 *
 * Three planes, bottom to top: a canvas with the pictures (density, thickness), the stress figure as the HTML
 * report draws it (its own SVG, placed and scaled with the view, so its lines stay sharp at any zoom), and the
 * canvas that takes the pointer, with the outlines, passive regions, findings and scale bar.
 */
import type { NumberedFinding } from '../../src/check/findings.js';
import { fmt } from '../../src/report/number.js';
import type { PassiveRegions } from '../../src/passive/types.js';
import type { FlatRings, GridView, PlacedRgba, StressLayer } from '../shared/protocol.js';

export type LayerId = 'density' | 'thickness' | 'stress' | 'outline' | 'repair' | 'passive' | 'findings';

export const LAYERS: readonly { id: LayerId; label: string; on: boolean }[] = [
  { id: 'density', label: 'density', on: true },
  { id: 'thickness', label: 'thickness map', on: false },
  { id: 'stress', label: 'stress (re-check)', on: true },
  { id: 'outline', label: 'outline', on: true },
  { id: 'repair', label: 'repair changes', on: true },
  { id: 'passive', label: 'passive regions', on: true },
  { id: 'findings', label: 'findings', on: true },
];

/** What the view draws; each part may be missing. */
export interface Scene {
  domain: readonly [number, number, number, number];
  density: { img: CanvasImageSource; extent: readonly [number, number, number, number] } | null;
  thickness: { img: CanvasImageSource; extent: readonly [number, number, number, number] } | null;
  outline: Path2D | null;
  /** True while the outline is newer than the checks (the fast first answer). */
  outlineOnly: boolean;
  beforeRepair: Path2D | null;
  repaired: Path2D | null;
  passive: PassiveRegions | null;
  findings: readonly NumberedFinding[];
  grid: GridView | null;
  /** The stress figure of the structural re-check (`--loads`), or null. */
  stress: StressLayer | null;
  /** True while the stress figure belongs to an older result than the outline shown (drawn faded). */
  stressStale: boolean;
}

const SVG_NS = 'http://www.w3.org/2000/svg';

/** A Path2D of rings in mm (drawn under the view transform). */
export function ringsPath(f: FlatRings): Path2D {
  const p = new Path2D();
  for (let r = 0; r + 1 < f.start.length; r++) {
    const a = f.start[r];
    const b = f.start[r + 1];
    if (b - a < 2) continue;
    p.moveTo(f.coords[2 * a], f.coords[2 * a + 1]);
    for (let k = a + 1; k < b; k++) p.lineTo(f.coords[2 * k], f.coords[2 * k + 1]);
    p.closePath();
  }
  return p;
}

/** An RGBA picture as something the canvas can draw. */
export function imageOf(p: PlacedRgba): { img: CanvasImageSource; extent: readonly [number, number, number, number] } {
  const c = document.createElement('canvas');
  c.width = p.width;
  c.height = p.height;
  c.getContext('2d')!.putImageData(new ImageData(new Uint8ClampedArray(p.rgba), p.width, p.height), 0, 0);
  return { img: c, extent: p.extent };
}

function niceBelow(x: number): number {
  const p = 10 ** Math.floor(Math.log10(x));
  const m = x / p;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
}

export class PlanView {
  readonly canvas: HTMLCanvasElement;
  /** The pictures' plane, under the stress figure. */
  private readonly back: HTMLCanvasElement;
  /** The stress figure's plane. */
  private readonly stressSvg: SVGSVGElement;
  private stressShown: StressLayer | null = null;
  readonly readout: HTMLElement;
  scene: Scene | null = null;
  readonly shown: Record<LayerId, boolean>;
  /** Pixels (CSS) per mm, and the screen position (CSS px) of the report frame's origin. */
  private s = 1;
  private ox = 0;
  private oy = 0;
  private fitted = false;
  private drag: { x: number; y: number; ox: number; oy: number } | null = null;
  onFindingClick: ((n: number) => void) | null = null;

  constructor(canvas: HTMLCanvasElement, readout: HTMLElement) {
    this.canvas = canvas;
    this.readout = readout;
    this.shown = Object.fromEntries(LAYERS.map((l) => [l.id, l.on])) as Record<LayerId, boolean>;
    this.back = document.createElement('canvas');
    this.back.className = 'plane';
    this.back.setAttribute('aria-hidden', 'true');
    this.stressSvg = document.createElementNS(SVG_NS, 'svg');
    this.stressSvg.setAttribute('class', 'plane stress');
    this.stressSvg.setAttribute('id', 'stress-layer');
    this.stressSvg.setAttribute('preserveAspectRatio', 'none');
    this.stressSvg.setAttribute('role', 'img');
    this.stressSvg.setAttribute('aria-label', 'von Mises stress of the final geometry with supports, loads and the deformed outline');
    canvas.before(this.back, this.stressSvg);
    canvas.addEventListener('wheel', (e) => this.wheel(e), { passive: false });
    canvas.addEventListener('pointerdown', (e) => {
      this.drag = { x: e.clientX, y: e.clientY, ox: this.ox, oy: this.oy };
      canvas.setPointerCapture(e.pointerId);
      canvas.classList.add('dragging');
    });
    canvas.addEventListener('pointermove', (e) => {
      if (this.drag) {
        this.ox = this.drag.ox + e.clientX - this.drag.x;
        this.oy = this.drag.oy + e.clientY - this.drag.y;
        this.draw();
      }
      this.showCursor(e);
    });
    const end = (e: PointerEvent) => {
      if (this.drag && Math.hypot(e.clientX - this.drag.x, e.clientY - this.drag.y) < 3) this.click(e);
      this.drag = null;
      canvas.classList.remove('dragging');
    };
    canvas.addEventListener('pointerup', end);
    canvas.addEventListener('pointercancel', () => (this.drag = null));
    canvas.addEventListener('pointerleave', () => (this.readout.textContent = this.hint()));
    canvas.addEventListener('dblclick', () => this.fit());
    new ResizeObserver(() => this.draw()).observe(canvas);
  }

  private hint(): string {
    return 'drag to pan · wheel to zoom · double-click to fit';
  }

  /** Screen (CSS px, relative to the canvas) → report frame mm. */
  toMm(px: number, py: number): [number, number] {
    return [(px - this.ox) / this.s, (this.oy - py) / this.s];
  }

  private local(e: MouseEvent): [number, number] {
    const r = this.canvas.getBoundingClientRect();
    return [e.clientX - r.left, e.clientY - r.top];
  }

  private wheel(e: WheelEvent): void {
    e.preventDefault();
    const [px, py] = this.local(e);
    const k = Math.exp(-e.deltaY * (e.deltaMode === 1 ? 0.05 : 0.0015));
    this.zoomAbout(px, py, k);
  }

  zoomAbout(px: number, py: number, k: number): void {
    const s = Math.min(Math.max(this.s * k, 1e-3), 1e5);
    this.ox = px - ((px - this.ox) * s) / this.s;
    this.oy = py - ((py - this.oy) * s) / this.s;
    this.s = s;
    this.draw();
  }

  /** Fits the domain (or a rectangle of it, mm) into the canvas with a margin. */
  fit(rect?: readonly [number, number, number, number]): void {
    const d = rect ?? this.scene?.domain;
    if (!d) return;
    const w = this.canvas.clientWidth;
    const h = this.canvas.clientHeight;
    if (w === 0 || h === 0) return;
    const dw = Math.max(d[2] - d[0], 1e-9);
    const dh = Math.max(d[3] - d[1], 1e-9);
    this.s = Math.min((w - 40) / dw, (h - 50) / dh);
    this.ox = (w - this.s * dw) / 2 - this.s * d[0];
    this.oy = (h - 10 + this.s * dh) / 2 + this.s * d[1];
    this.fitted = true;
    this.draw();
  }

  /** Zooms to a finding: a square of a few cells (or of `size` mm) around it. */
  zoomTo(x: number, y: number, size: number): void {
    this.fit([x - size / 2, y - size / 2, x + size / 2, y + size / 2]);
  }

  setScene(scene: Scene): void {
    this.scene = scene;
    if (!this.fitted) this.fit();
    else this.draw();
  }

  private click(e: PointerEvent): void {
    const sc = this.scene;
    if (!sc || !this.shown.findings || !this.onFindingClick) return;
    const [px, py] = this.local(e);
    let best: NumberedFinding | null = null;
    let bestD = 12;
    for (const f of sc.findings) {
      const d = Math.hypot(this.ox + this.s * f.location.x - px, this.oy - this.s * f.location.y - py);
      if (d < bestD) {
        bestD = d;
        best = f;
      }
    }
    if (best) this.onFindingClick(best.n);
  }

  private showCursor(e: PointerEvent): void {
    const [px, py] = this.local(e);
    const [x, y] = this.toMm(px, py);
    let text = `x ${fmt(x, 5)} mm  y ${fmt(y, 5)} mm`;
    const g = this.scene?.grid;
    if (g) {
      const [hx, hy] = g.cellSize;
      const fi = (x - g.origin[0]) / hx;
      const fj = (y - g.origin[1]) / hy;
      const i = g.placement === 'nodes' ? Math.round(fi) : Math.floor(fi);
      const j = g.placement === 'nodes' ? Math.round(fj) : Math.floor(fj);
      if (i >= 0 && j >= 0 && i < g.nx && j < g.ny) {
        const v = g.values[j * g.nx + i];
        const what = g.placement === 'nodes' ? 'node' : 'cell';
        if (g.mirrored) text += `  ·  ${what} ${i + 1}, ${j + 1} of the unfolded grid (mirror)`;
        else text += `  ·  ${what}: file row ${g.topDown ? g.fileRows - j : j + 1}, col ${i + 1}`;
        text += `  ·  density ${fmt(v, 4)}`;
      }
    }
    this.readout.textContent = text;
  }

  /** Sizes a canvas to its box in device pixels; returns its context, cleared, and the box in CSS px. */
  private plane(c: HTMLCanvasElement, dpr: number): { g: CanvasRenderingContext2D; w: number; h: number } {
    const w = this.canvas.clientWidth;
    const h = this.canvas.clientHeight;
    if (c.width !== Math.round(w * dpr) || c.height !== Math.round(h * dpr)) {
      c.width = Math.round(w * dpr);
      c.height = Math.round(h * dpr);
    }
    const g = c.getContext('2d')!;
    g.setTransform(1, 0, 0, 1, 0, 0);
    g.clearRect(0, 0, c.width, c.height);
    return { g, w, h };
  }

  /**
   * Places the stress figure: its viewBox (figure frame, mm: x' = x − minX, y' = maxY − y, with a margin m)
   * covers the screen box of the report-frame rectangle [minX − m, maxY + m] … [minX + w + m, maxY − h − m].
   */
  private placeStress(sc: Scene): void {
    const st = this.shown.stress ? sc.stress : null;
    const svg = this.stressSvg;
    if (st !== this.stressShown) {
      this.stressShown = st;
      svg.setAttribute('viewBox', st ? st.viewBox : '0 0 1 1');
      svg.innerHTML = st ? st.body : '';
    }
    svg.style.display = st ? '' : 'none';
    if (!st) return;
    const m = st.margin;
    svg.style.left = `${this.ox + this.s * (st.minX - m)}px`;
    svg.style.top = `${this.oy - this.s * (st.maxY + m)}px`;
    svg.style.width = `${this.s * (st.w + 2 * m)}px`;
    svg.style.height = `${this.s * (st.h + 2 * m)}px`;
    svg.style.opacity = sc.stressStale ? '0.35' : '';
  }

  draw(): void {
    const dpr = window.devicePixelRatio || 1;
    const { g: b } = this.plane(this.back, dpr);
    const { g, h } = this.plane(this.canvas, dpr);
    b.fillStyle = '#f4f6f8';
    b.fillRect(0, 0, this.back.width, this.back.height);
    const sc = this.scene;
    if (!sc) {
      this.stressSvg.style.display = 'none';
      return;
    }
    const s = this.s * dpr;
    const toMm = () => g.setTransform(s, 0, 0, -s, this.ox * dpr, this.oy * dpr);
    const px = 1 / s; // one device pixel in mm
    toMm();
    b.setTransform(s, 0, 0, -s, this.ox * dpr, this.oy * dpr);
    const [x0, y0, x1, y1] = sc.domain;
    b.fillStyle = '#fff';
    b.fillRect(x0, y0, x1 - x0, y1 - y0);
    b.imageSmoothingEnabled = false;
    const picture = (p: Scene['density']) => {
      if (!p) return;
      const [a, bb, cc, d] = p.extent;
      // the image's rows run top-down: draw it flipped back under the y-up transform
      b.save();
      b.translate(a, d);
      b.scale(1, -1);
      b.drawImage(p.img, 0, 0, cc - a, d - bb);
      b.restore();
    };
    b.save();
    b.beginPath();
    b.rect(x0, y0, x1 - x0, y1 - y0);
    b.clip();
    if (this.shown.density) picture(sc.density);
    if (this.shown.thickness) picture(sc.thickness);
    b.restore();
    this.placeStress(sc);
    const stressOn = this.shown.stress && sc.stress !== null;
    g.lineWidth = dpr * px;
    g.setLineDash([4 * dpr * px, 3 * dpr * px]);
    g.strokeStyle = '#9aa3ad';
    g.strokeRect(x0, y0, x1 - x0, y1 - y0);
    g.setLineDash([]);
    if (this.shown.repair && sc.repaired) {
      g.fillStyle = 'rgba(20,150,60,.55)';
      g.fill(sc.repaired, 'evenodd');
    }
    if (this.shown.outline && sc.outline) {
      // over the stress colours the outline is a line only: a tint would change the colours the scale reads
      if (!stressOn || sc.stressStale) {
        g.fillStyle = this.shown.density || this.shown.thickness ? 'rgba(11,92,192,.12)' : 'rgba(11,92,192,.25)';
        g.fill(sc.outline, 'evenodd');
      }
      g.strokeStyle = sc.outlineOnly ? '#d9480f' : '#0b5cc0';
      g.lineWidth = 1.6 * dpr * px;
      g.stroke(sc.outline);
    }
    if (this.shown.repair && sc.beforeRepair && !sc.outlineOnly) {
      g.strokeStyle = '#555';
      g.lineWidth = 1.1 * dpr * px;
      g.setLineDash([4 * dpr * px, 3 * dpr * px]);
      g.stroke(sc.beforeRepair);
      g.setLineDash([]);
    }
    if (this.shown.passive && sc.passive) {
      for (const r of sc.passive.regions) {
        const p = new Path2D();
        const sh = r.shape;
        if (sh.kind === 'circle') p.arc(sh.cx, sh.cy, sh.r, 0, 2 * Math.PI);
        else if (sh.kind === 'rect') p.rect(sh.x0, sh.y0, sh.x1 - sh.x0, sh.y1 - sh.y0);
        else {
          sh.points.forEach(([x, y], k) => (k === 0 ? p.moveTo(x, y) : p.lineTo(x, y)));
          p.closePath();
        }
        g.strokeStyle = r.role === 'solid' ? '#6a2c91' : '#c2410c';
        g.lineWidth = 1.5 * dpr * px;
        g.setLineDash(r.role === 'solid' ? [] : [3 * dpr * px, 2 * dpr * px]);
        g.stroke(p);
      }
      g.setLineDash([]);
    }
    // screen-space overlays
    g.setTransform(dpr, 0, 0, dpr, 0, 0);
    if (this.shown.findings && !sc.outlineOnly) {
      g.font = '600 12px system-ui, sans-serif';
      g.textBaseline = 'middle';
      for (const f of [...sc.findings].reverse()) {
        const X = this.ox + this.s * f.location.x;
        const Y = this.oy - this.s * f.location.y;
        g.beginPath();
        g.arc(X, Y, 7, 0, 2 * Math.PI);
        g.lineWidth = 2.2;
        g.strokeStyle = f.status === 'fail' ? '#d01c1c' : '#e89a00';
        g.stroke();
        g.lineWidth = 3;
        g.strokeStyle = '#fff';
        g.strokeText(String(f.n), X + 9, Y - 7);
        g.fillStyle = f.status === 'fail' ? '#d01c1c' : '#a86a00';
        g.fillText(String(f.n), X + 9, Y - 7);
      }
    }
    // scale bar, bottom left
    const len = niceBelow(Math.max(1e-9, 120 / this.s));
    const L = len * this.s;
    const bx = 14;
    const by = h - 16;
    g.font = '12px system-ui, sans-serif';
    const label = `${fmt(len)} mm`;
    g.fillStyle = 'rgba(255,255,255,.85)';
    g.fillRect(bx - 6, by - 11, L + g.measureText(label).width + 20, 22);
    g.strokeStyle = '#1d232b';
    g.lineWidth = 1.5;
    g.beginPath();
    g.moveTo(bx, by - 4);
    g.lineTo(bx, by + 4);
    g.moveTo(bx, by);
    g.lineTo(bx + L, by);
    g.moveTo(bx + L, by - 4);
    g.lineTo(bx + L, by + 4);
    g.stroke();
    g.fillStyle = '#1d232b';
    g.fillText(label, bx + L + 6, by);
  }
}
