/**
 * The terminal block of the structural re-check (`--loads`, docs/structure.md): compliance of the input design,
 * the geometry before repair and the final geometry, the change, the largest displacement and the peak stress
 * with their places (mm, report frame y up), the solver's iterations and residuals, and the coarsening.
 */
import type { Report, StructureAnalysis } from '../types.js';
import { fmt } from './number.js';

const at = (p: { x: number; y: number }): string => `at x ${fmt(p.x)}, y ${fmt(p.y)} mm`;

function signedPct(v: number): string {
  const t = fmt(Math.abs(100 * v), 3);
  return `${v > 0 && t !== '0' ? '+' : v < 0 && t !== '0' ? '−' : ''}${t} %`;
}

function designLine(name: string, a: StructureAnalysis): string[] {
  const s = a.solver;
  return [
    `  ${name.padEnd(14)}compliance ${fmt(a.compliance, 5)} N·mm; largest displacement ${fmt(a.maxDisplacement.value, 3)} mm ${at(a.maxDisplacement)}`,
    `  ${''.padEnd(14)}peak von Mises ${a.peakStress ? `${fmt(a.peakStress.value, 4)} MPa ${at(a.peakStress)}` : '– (no element at least half full)'}`,
    `  ${''.padEnd(14)}solver ${s.iterations} CG iterations, residual ${s.relativeResidual.toExponential(1)}${s.converged ? '' : ' — NOT CONVERGED, numbers approximate'}, ${fmt(s.seconds, 2)} s`,
  ];
}

/** The block's lines, or none when the run had no `--loads`. */
export function structureLines(r: Report): string[] {
  const st = r.structure;
  if (!st) return [];
  const d = st.designs;
  const [ex, ey] = st.elements;
  const [hx, hy] = st.elementSize;
  return [
    `Structural re-check (--loads ${st.loadsFile}; plane stress, E ${fmt(st.material.E)} MPa, ν ${fmt(st.material.nu)}, t ${fmt(st.thickness)} mm)`,
    `  elements      ${ex} × ${ey} of ${fmt(hx)} × ${fmt(hy)} mm${st.coarsened > 1 ? ` (grid coarsened by ${st.coarsened}: above --fe-max-elements)` : ''}`,
    ...designLine('input design', d.input),
    ...(d.beforeRepair ? designLine('before repair', d.beforeRepair) : []),
    ...designLine('final', d.final),
    `  change        compliance ${signedPct(st.complianceChange)} final vs input design (${st.complianceChange > 0 ? 'less stiff' : 'stiffer'})` +
      (d.beforeRepair ? `; the repair: ${signedPct(d.final.compliance / d.beforeRepair.compliance - 1)}` : ''),
    '  A linear plane-stress re-check on the grid, not a certified analysis; peaks at clamped edges, sharp corners',
    '  and point loads are singular and grow with refinement.',
  ];
}
