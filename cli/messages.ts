/** User-facing texts of the CLI. */
import { VERSION } from '../src/version.js';

export const HELP = `rhoform ${VERSION} — density grids to clean, closed, volume-preserving outlines

Usage:
  rhoform build   <grid> [options]   grid → DXF + SVG + report (the main job)
  rhoform check   <grid> [options]   the same run, the verdict on the terminal; writes no file, except the
                                     JSON and HTML reports when --out-dir is given
  rhoform inspect <grid> [--json]    size, range, mean, M_nd, grey share, non-finite count, histogram
  rhoform demo    [--out-dir <dir>]  build the bundled demo grid into ./rhoform-demo/ (with repair and its load case)
  rhoform batch   <files|folders…>   build many grids on worker threads; summary CSV + JSON (docs/scale.md)
  rhoform merge   <summary.json…>    join the summaries of sharded batch runs into one
  rhoform preview <grid> [options]   write <name>.preview.html: the grid in a live page to tune the
                                     settings by looking, with the same files (docs/preview.md)
  rhoform --help | --version

Input:
  --cell-size <mm>|<hx>,<hy>   cell size in mm (default 1, or a VTK file's spacing; the report says which)
  --row-order top-down|bottom-up   file row 1 is the top of the part (default top-down)
  --values cells|nodes         samples at cell centres (default) or on cell corners
  --layout grid|long|auto      CSV: a grid of values, or columns x, y, value (default auto)
  --value-range <lo>,<hi>      map lo..hi to 0..1 (default 0,1; e.g. 0,255)
  --decimal-comma              CSV: ',' is the decimal mark
  --non-finite error|void      NaN/Inf cells: refuse (default) or treat as void
  --clip                       clip values beyond the range (an overshoot ≤ 0.05 is always clipped)
  --max-cells <n>              refuse larger grids before reading them (default 50000000)
  --field <name>               MAT/VTK/VTI: the variable or array to read (needed when there are several)
  --image-solid dark|light     PNG: which end of the grey scale is solid (default dark)
  --image-channel luminance|r|g|b   PNG: the channel of a colour image (luminance = Rec. 709 luma)
  Grids are CSV, NPY, MAT (level 5, -v7), VTK (legacy STRUCTURED_POINTS), VTI (XML ImageData) or PNG,
  recognised by content (docs/formats.md). A VTK file's spacing is its cell size unless --cell-size is given.
Geometry:
  --volume-fraction <0..1>     target solid fraction (default: the mean density)
  --volume-tolerance <rel>     relative tolerance on the smoothed area (default 0.001)
  --level <v>                  fixed iso-level instead of the volume-preserving search
  --saddle decider|join|split  saddle rule of marching squares (default decider)
  --smooth <n>                 Taubin λ|μ iterations (default 2; 0 = off)
  --tolerance <mm>             largest deviation of the final outline from the raw contour (default 0.25 cell)
  --mirror left|right|bottom|top   that edge is a symmetry plane; the mirror image is added beyond it
                               (repeatable: one of left/right and one of bottom/top; docs/symmetry.md)
  --passive <file.json>        passive-solid / passive-void circles, rectangles, polygons in mm (docs/passive.md)
  --circles                    write rings that are circles within the tolerance as true circles
Checks (docs/checks/; a check that is off is absent from the report):
  --min-member <mm>            thinnest allowed member (local width of the solid)
  --min-hole <mm>              narrowest allowed hole or gap
  --tool-radius <mm>           milling tool radius: concave corners tighter than it are findings
  --min-island-area <mm²>      islands up to this area are tolerated (default 0: every extra piece warns)
  --min-hole-area <mm²>        smallest allowed hole area (default 4 cell areas: below the grid's resolution)
  --grey-warn <%>              warn when the input's M_nd is above this (default 25)
  --process <id>               default limits of a process: laser-cut, waterjet-cut, milling, material-extrusion,
                               vat-photopolymerization, pbf-polymer, pbf-metal (docs/processes.md)
  --thickness <mm>             sheet thickness (required by laser-cut and waterjet-cut)
  --severity <id>=off|warn|fail   change a check's severity (repeatable)
  --fail-on warn|fail          exit 1 on warnings too (default: only on failures)
Structural re-check (docs/structure.md; plane-stress FE on the grid, not a certified analysis):
  --loads <file.json>          material, thickness, supports and loads in mm and N: analyse the input design and
                               the final geometry (and the geometry before repair); adds stiffness-change and load-path
  --max-stiffness-loss <%>     stiffness-change limit: compliance increase over the input design (default 10)
  --allowable-stress <MPa>     peak-stress check: the final geometry's peak von Mises stress against it (default off)
  --fe-max-elements <n>        coarsen the analysis grid by an integer factor above this (default 500000)
                               (--thickness gives the plate thickness when the loads file does not; both must agree)
Repair (docs/repair.md; the size checks run again on the result, which sets the exit code):
  --repair[=<list>]            all repairs, or some of: thicken, fill-holes, open-corners, drop-islands
Batch (docs/scale.md):
  --jobs <n>                   worker threads (default: the number of cores)
  --shard <k>/<n>              only files i (sorted, from 0) with (i mod n) + 1 = k, for cluster array jobs
Output:
  --out-dir <dir>              where files go (default: the current folder; demo: ./rhoform-demo;
                               check writes its reports only when --out-dir is given)
  --formats dxf,svg,json,html  which files to write (default: those four; also stl and 3mf, the part
                               extruded by --thickness)
  --units mm|in                DXF/SVG units (the report is always in mm)
  --annotations                also write <name>.notes.dxf (passive references, findings, repair regions, on
                               layers that do not plot) and draw them in the SVG; off: the files hold the part
  --arcs                       fit the outline with circular arcs and lines within --tolerance
  --dxf-version r12|r2000      DXF version of the part (default r2000; r12 for older machine software)
  --json                       print the JSON report on stdout and nothing else
  --force                      replace existing output files
  --quiet                      no summary on stdout, no progress on stderr
  --timings                    print the time of every stage and the peak memory on stderr (build, check, demo)
  --no-color                   no colour (also NO_COLOR)

Exit codes: 0 every check passed (warnings allowed unless --fail-on warn), 1 a check failed (geometry still
written), 2 bad input, usage or output error (nothing written).

Caution: re-analyse the final geometry before use; process limits are generic defaults only; the fabricator's
limits, local codes and licensed engineering practice govern.
`;
