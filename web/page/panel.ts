/**
 * The report panel: the summary, check table, findings and repairs exactly as the HTML report shows them —
 * taken from the report module's own output (formatHtml, no pictures), in a shadow root with the report's
 * style sheet — plus, with `--loads`, the structural re-check's block as the command line prints it
 * (report/structure-text.ts), and the cautions. A click on a finding row zooms the view to it.
 */
import { PAGE_CSS } from '../../src/report/page-style.js';
import { structureLines } from '../../src/report/structure-text.js';
import type { Report } from '../../src/types.js';

/** Adjustments for the report's sections inside a panel rather than a page of their own. */
const PANEL_CSS = `
:host{display:block}
.panel{font:14px/1.4 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:var(--ink)}
header h1{display:none}
.result{margin:.1rem 0 .5rem}
h2{margin:1rem 0 .4rem}
table.findings tbody tr{cursor:pointer}
table.findings tr.sel{background:#fff3c4}
.cautions{margin:.8rem 0}
.waiting{margin:.2rem 0 .4rem;padding:.3rem .6rem;background:#fff6dd;border-left:3px solid #e0a800;font-size:.85rem}
pre.structure{font:12px/1.45 ui-monospace,Menlo,Consolas,monospace;background:#f6f8fa;border:1px solid var(--rule);padding:.5rem .7rem;overflow:auto;white-space:pre}
`;

export class ReportPanel {
  private readonly root: ShadowRoot;
  private readonly body: HTMLElement;
  onFinding: (n: number) => void = () => {};

  constructor(host: HTMLElement) {
    this.root = host.attachShadow({ mode: 'open' });
    const style = document.createElement('style');
    style.textContent = PAGE_CSS.replace(':root{', ':host{') + PANEL_CSS;
    this.body = document.createElement('div');
    this.body.className = 'panel';
    this.root.append(style, this.body);
    this.body.addEventListener('click', (e) => {
      const tr = (e.target as Element).closest('tr[id^="finding-"]');
      if (tr) {
        const n = Number(tr.id.slice(8));
        this.highlight(n, false);
        this.onFinding(n);
        e.preventDefault();
      }
      const a = (e.target as Element).closest('a[href^="#"]');
      if (a) {
        e.preventDefault();
        this.root.getElementById(a.getAttribute('href')!.slice(1))?.scrollIntoView({ block: 'nearest' });
      }
    });
  }

  /**
   * Shows the sections of `html` (formatHtml of `report`). `waiting`: the report of a build without the structural
   * re-check, shown while the re-check runs, under a note saying so.
   */
  show(html: string, report: Report, waiting = false): void {
    const doc = new DOMParser().parseFromString(html, 'text/html');
    const out: Node[] = [];
    if (waiting) {
      const p = doc.createElement('p');
      p.className = 'waiting';
      p.id = 'waiting';
      p.textContent = 'Structural re-check running: these are the checks without it; stiffness-change, peak-stress and load-path, and the summary with them, follow.';
      out.push(p);
    }
    const header = doc.querySelector('header');
    if (header) out.push(header);
    // from the checks heading up to the details block: checks, findings, repairs
    let n: Element | null = doc.getElementById('checks');
    while (n && !n.classList.contains('cols')) {
      out.push(n);
      n = n.nextElementSibling;
    }
    const lines = structureLines(report);
    if (lines.length > 0) {
      const h = doc.createElement('h2');
      h.id = 'structure';
      h.textContent = 'Structural re-check';
      const pre = doc.createElement('pre');
      pre.className = 'structure';
      pre.textContent = lines.join('\n');
      out.push(h, pre);
    }
    const cautions = doc.querySelector('section.cautions');
    if (cautions) out.push(cautions);
    this.body.replaceChildren(...out.map((x) => document.importNode(x, true)));
  }

  /** Marks finding `n`'s row and brings it into view. */
  highlight(n: number, scroll = true): void {
    for (const tr of this.root.querySelectorAll('tr.sel')) tr.classList.remove('sel');
    const tr = this.root.getElementById(`finding-${n}`);
    if (!tr) return;
    tr.classList.add('sel');
    if (scroll) tr.scrollIntoView({ block: 'nearest' });
  }
}
