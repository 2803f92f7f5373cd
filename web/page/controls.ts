/**
 * The preview page's controls: one per tuned setting, each tied to a report.settings key. A control hands its
 * raw text to the page (which parses it exactly as the command line would) and shows an error under itself;
 * it never resets a bad value silently.
 */
import { PROCESS_IDS } from '../../src/check/process.js';
import { fmt } from '../../src/report/number.js';
import { REPAIR_IDS } from '../../src/settings.js';

export type Change = Record<string, unknown>;

interface Base {
  readonly key: string;
  readonly label: string;
  readonly help: string;
}
type Spec =
  | (Base & { kind: 'text'; unit: string; slider?: { min: number; max: number; step: number } })
  | (Base & { kind: 'select'; options: readonly string[]; none?: string })
  | (Base & { kind: 'check' });

const GROUPS: readonly { title: string; specs: readonly Spec[] }[] = [
  {
    title: 'Threshold',
    specs: [
      { key: 'volumeFraction', kind: 'text', label: 'volume target', unit: '0..1', help: '--volume-fraction; empty: the mean density', slider: { min: 0, max: 1, step: 0.001 } },
      { key: 'level', kind: 'text', label: 'fixed level', unit: '', help: '--level; empty: the volume-preserving search', slider: { min: 0, max: 1, step: 0.001 } },
      { key: 'saddle', kind: 'select', label: 'saddle rule', options: ['decider', 'join', 'split'], help: '--saddle' },
    ],
  },
  {
    title: 'Outline',
    specs: [
      { key: 'smooth', kind: 'text', label: 'smoothing iterations', unit: '', help: '--smooth (Taubin λ|μ pairs)', slider: { min: 0, max: 20, step: 1 } },
      { key: 'tolerance', kind: 'text', label: 'tolerance', unit: 'mm', help: '--tolerance; empty: a quarter cell' },
      { key: 'circles', kind: 'check', label: 'write circles as circles', help: '--circles' },
      { key: 'passive', kind: 'check', label: 'passive regions', help: '--passive (the embedded file)' },
    ],
  },
  {
    title: 'Checks',
    specs: [
      { key: 'process', kind: 'select', label: 'process', options: PROCESS_IDS, none: '(none)', help: '--process: generic limits of a process' },
      { key: 'thickness', kind: 'text', label: 'sheet thickness', unit: 'mm', help: '--thickness' },
      { key: 'minMember', kind: 'text', label: 'min member', unit: 'mm', help: '--min-member; empty: off or the process value' },
      { key: 'minHole', kind: 'text', label: 'min hole', unit: 'mm', help: '--min-hole' },
      { key: 'toolRadius', kind: 'text', label: 'tool radius', unit: 'mm', help: '--tool-radius' },
      { key: 'minIslandArea', kind: 'text', label: 'island area tolerated', unit: 'mm²', help: '--min-island-area' },
      { key: 'minHoleArea', kind: 'text', label: 'min hole area', unit: 'mm²', help: '--min-hole-area' },
    ],
  },
  {
    title: 'Structure',
    specs: [
      { key: 'loads', kind: 'check', label: 'structural re-check', help: '--loads (the embedded load case)' },
      { key: 'maxStiffnessLoss', kind: 'text', label: 'max stiffness loss', unit: '%', help: '--max-stiffness-loss; compliance increase over the input design' },
      { key: 'allowableStress', kind: 'text', label: 'allowable stress', unit: 'MPa', help: '--allowable-stress; empty: peak-stress off' },
      { key: 'feMaxElements', kind: 'text', label: 'max elements', unit: '', help: '--fe-max-elements; above it the grid is coarsened' },
    ],
  },
  {
    title: 'Repair',
    specs: REPAIR_IDS.map((id) => ({ key: `repair:${id}`, kind: 'check' as const, label: id, help: `--repair=${id}` })),
  },
  {
    title: 'Files',
    specs: [{ key: 'units', kind: 'select', label: 'DXF/SVG units', options: ['mm', 'in'], help: '--units' }],
  },
];

/** The settings of the structural re-check beside `loads`: they apply only with it (the CLI refuses them without). */
const STRUCTURE_KEYS = ['maxStiffnessLoss', 'allowableStress', 'feMaxElements'] as const;

/** One control on the page. */
interface Control {
  readonly spec: Spec;
  readonly input: HTMLInputElement | HTMLSelectElement;
  readonly slider: HTMLInputElement | null;
  readonly error: HTMLElement;
}

function el<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Record<string, string> = {}, text = ''): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
  if (text) e.textContent = text;
  return e;
}

export class Controls {
  private readonly controls = new Map<string, Control>();
  /** Called with a change (keys as in report.settings; text as typed). */
  onChange: (change: Change, keys: readonly string[]) => void = () => {};

  constructor(host: HTMLElement, hasPassive: boolean, hasLoads: boolean) {
    for (const g of GROUPS) {
      if (g.title === 'Structure' && !hasLoads) continue;
      const fs = el('fieldset');
      fs.append(el('legend', {}, g.title));
      for (const spec of g.specs) {
        if (spec.key === 'passive' && !hasPassive) continue;
        fs.append(this.make(spec));
      }
      host.append(fs);
    }
  }

  private make(spec: Spec): HTMLElement {
    const row = el('div', { class: `ctl ctl-${spec.kind}`, 'data-key': spec.key, title: spec.help });
    const id = `ctl-${spec.key.replace(':', '-')}`;
    const error = el('div', { class: 'err', role: 'alert', id: `${id}-error` });
    let input: HTMLInputElement | HTMLSelectElement;
    let slider: HTMLInputElement | null = null;
    if (spec.kind === 'check') {
      input = el('input', { type: 'checkbox', id });
      const label = el('label', { for: id }, spec.label);
      row.append(input, label);
      input.addEventListener('change', () => this.changed(spec));
    } else if (spec.kind === 'select') {
      const sel = el('select', { id });
      if (spec.none) sel.append(el('option', { value: '' }, spec.none));
      for (const o of spec.options) sel.append(el('option', { value: o }, o));
      input = sel;
      row.append(el('label', { for: id }, spec.label), sel);
      sel.addEventListener('change', () => this.changed(spec));
    } else {
      input = el('input', { type: 'text', id, inputmode: 'decimal', autocomplete: 'off', spellcheck: 'false' });
      const label = el('label', { for: id }, spec.label);
      const unit = el('span', { class: 'unit' }, spec.unit);
      const line = el('div', { class: 'line' });
      line.append(input, unit);
      row.append(label, line);
      input.addEventListener('change', () => this.changed(spec));
      input.addEventListener('keydown', (e) => {
        if ((e as KeyboardEvent).key === 'Enter') this.changed(spec);
      });
      if (spec.slider) {
        const s = spec.slider;
        slider = el('input', { type: 'range', id: `${id}-slider`, min: String(s.min), max: String(s.max), step: String(s.step), 'aria-label': `${spec.label} slider` });
        row.append(slider);
        const sl = slider;
        sl.addEventListener('input', () => {
          (input as HTMLInputElement).value = sl.value;
          this.changed(spec);
        });
      }
    }
    row.append(error);
    this.controls.set(spec.key, { spec, input, slider, error });
    return row;
  }

  private repairList(): string[] {
    return REPAIR_IDS.filter((id) => (this.controls.get(`repair:${id}`)?.input as HTMLInputElement | undefined)?.checked);
  }

  private changed(spec: Spec): void {
    const c = this.controls.get(spec.key)!;
    if (spec.key.startsWith('repair:')) {
      this.onChange({ repair: this.repairList() }, [spec.key]);
      return;
    }
    let value: unknown;
    if (spec.kind === 'check') value = (c.input as HTMLInputElement).checked;
    else {
      const t = c.input.value;
      value = t.trim() === '' ? null : t;
    }
    if (spec.key === 'passive' || spec.key === 'loads') value = value ? 'embedded' : null;
    const change: Change = { [spec.key]: value };
    // the re-check's limits go with it (the command line refuses them without --loads)
    if (spec.key === 'loads' && value === null) for (const k of STRUCTURE_KEYS) change[k] = null;
    // a fixed level replaces the volume search and the other way round
    if (spec.key === 'level' && value !== null) change.volumeFraction = null;
    if (spec.key === 'volumeFraction') change.level = null;
    this.onChange(change, [spec.key]);
  }

  /** The control keys a settings key belongs to (repair → each repair box). */
  keysOf(settingKey: string): string[] {
    if (settingKey === 'repair') return REPAIR_IDS.map((id) => `repair:${id}`);
    return this.controls.has(settingKey) ? [settingKey] : [];
  }

  /** The setting key named by a CLI error message ("--min-member: …"), if any control has it. */
  keyOfMessage(message: string): string | null {
    for (const c of this.controls.values()) {
      const flag = c.spec.help.split(/[;, ]/)[0].replace(/=.*/, '');
      if (flag.startsWith('--') && (message.startsWith(`${flag}:`) || message.startsWith(`${flag} `) || message.includes(` ${flag} `))) return c.spec.key;
    }
    return null;
  }

  showError(keys: readonly string[], message: string): void {
    for (const k of keys) {
      const c = this.controls.get(k);
      if (!c) continue;
      c.error.textContent = message;
      c.input.setAttribute('aria-invalid', 'true');
      c.input.setAttribute('aria-describedby', c.error.id);
    }
  }

  /** Puts a value set by a script into its text control (so a refused value shows where it is refused). */
  showValue(key: string, value: unknown): void {
    const c = this.controls.get(key);
    if (!c || c.spec.kind !== 'text') return;
    c.input.value = value === null || value === undefined ? '' : typeof value === 'string' ? value : JSON.stringify(value);
  }

  clearErrors(keys?: readonly string[]): void {
    for (const [k, c] of this.controls) {
      if (keys && !keys.includes(k)) continue;
      c.error.textContent = '';
      c.input.removeAttribute('aria-invalid');
    }
  }

  hasError(key: string): boolean {
    return (this.controls.get(key)?.error.textContent ?? '') !== '';
  }

  /**
   * Shows the state: `given` (the options set, as the parser returned them) and `resolved` (report.settings,
   * for placeholders). A control with an error keeps what the user typed.
   */
  show(
    given: Record<string, unknown>,
    resolved: Record<string, unknown>,
    threshold: { level: number | null; targetFraction: number },
    passiveOn: boolean,
    loadsOn: boolean,
  ): void {
    for (const [key, c] of this.controls) {
      if (this.hasError(key)) continue;
      const focused = document.activeElement === c.input;
      if (key.startsWith('repair:')) {
        (c.input as HTMLInputElement).checked = ((resolved.repair as string[]) ?? []).includes(key.slice(7));
        continue;
      }
      if (key === 'passive' || key === 'loads') {
        (c.input as HTMLInputElement).checked = key === 'passive' ? passiveOn : loadsOn;
        continue;
      }
      if ((STRUCTURE_KEYS as readonly string[]).includes(key)) (c.input as HTMLInputElement).disabled = !loadsOn;
      if (c.spec.kind === 'check') {
        (c.input as HTMLInputElement).checked = resolved[key] === true;
        continue;
      }
      if (c.spec.kind === 'select') {
        const v = resolved[key];
        c.input.value = v === null || v === undefined ? '' : String(v);
        continue;
      }
      const inp = c.input as HTMLInputElement;
      const g = given[key];
      if (!focused) inp.value = g === undefined || g === null ? '' : String(g);
      let shown: number | null = null;
      if (key === 'volumeFraction') shown = typeof g === 'number' ? g : threshold.targetFraction;
      else if (key === 'level') shown = threshold.level;
      else if (typeof resolved[key] === 'number') shown = resolved[key] as number;
      inp.placeholder = shown === null ? 'off' : `${fmt(shown, 5)}${g === undefined ? (key === 'volumeFraction' ? ' (mean)' : key === 'level' ? ' (found)' : '') : ''}`;
      if (c.slider && shown !== null && !c.slider.matches(':active')) c.slider.value = String(shown);
    }
  }
}
