/**
 * 3MF package of a triangle mesh: the 3MF Core Specification (3MF Consortium, version 1.3) — an OPC package
 * (a ZIP, src/write/zip.ts) holding `[Content_Types].xml`, `_rels/.rels` (the relationship of type
 * http://schemas.microsoft.com/3dmanufacturing/2013/01/3dmodel to the model part) and `3D/3dmodel.model`: one
 * `<object type="model">` whose `<mesh>` lists the vertices and the triangles (v1 v2 v3 counter-clockwise seen
 * from outside, so the normals point out — the core specification's rule), `unit="millimeter"`, and a
 * `<build>` with one item. Coordinates with at most 6 decimals, deterministic.
 */
import type { Mesh } from '../geom/extrude.js';
import { TextSink } from './text-sink.js';
import { zipStored } from './zip.js';

const CONTENT_TYPES =
  '<?xml version="1.0" encoding="UTF-8"?>\n' +
  '<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">\n' +
  ' <Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/>\n' +
  ' <Default Extension="model" ContentType="application/vnd.ms-package.3dmanufacturing-3dmodel+xml"/>\n' +
  '</Types>\n';

const RELS =
  '<?xml version="1.0" encoding="UTF-8"?>\n' +
  '<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">\n' +
  ' <Relationship Target="/3D/3dmodel.model" Id="rel0" Type="http://schemas.microsoft.com/3dmanufacturing/2013/01/3dmodel"/>\n' +
  '</Relationships>\n';

/** The model XML (UTF-8 bytes); vertices in the mesh's own order. */
export function modelXml(mesh: Mesh): Uint8Array {
  const { vertices: v, triangles: t } = mesh;
  const out = new TextSink(256 + 60 * (v.length / 3) + 50 * (t.length / 3));
  out.str('<?xml version="1.0" encoding="UTF-8"?>\n');
  out.str('<model unit="millimeter" xml:lang="en-US" xmlns="http://schemas.microsoft.com/3dmanufacturing/core/2015/02">\n');
  out.str(' <metadata name="Application">rhoform</metadata>\n');
  out.str(' <resources>\n  <object id="1" type="model" name="part">\n   <mesh>\n    <vertices>\n');
  for (let k = 0; k < v.length; k += 3) {
    out.str('     <vertex x="').num(v[k], 6).str('" y="').num(v[k + 1], 6).str('" z="').num(v[k + 2], 6).str('"/>\n');
  }
  out.str('    </vertices>\n    <triangles>\n');
  for (let f = 0; f < t.length; f += 3) {
    out.str(`     <triangle v1="${t[f]}" v2="${t[f + 1]}" v3="${t[f + 2]}"/>\n`);
  }
  out.str('    </triangles>\n   </mesh>\n  </object>\n </resources>\n <build>\n  <item objectid="1"/>\n </build>\n</model>\n');
  return out.bytes();
}

/** The .3mf bytes (a stored ZIP). */
export function write3mf(mesh: Mesh): Uint8Array {
  const enc = new TextEncoder();
  return zipStored([
    { name: '[Content_Types].xml', data: enc.encode(CONTENT_TYPES) },
    { name: '_rels/.rels', data: enc.encode(RELS) },
    { name: '3D/3dmodel.model', data: modelXml(mesh) },
  ]);
}
