// Draws the demo cases' invented sketches (content/cases/files/*.png) from SVG with sharp.
// Run with `npx tsx scripts/make-demo-images.ts`; commit the PNGs it writes (the seed
// attaches the committed bytes, and the seed test checks their SHA-256).
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { projectRoot } from './lib/project.mjs';

const FILES = path.join(projectRoot, 'content', 'cases', 'files');
const W = 1200;
const H = 700;

/** Level (m AOD) → y pixel: 110 m at the top of the drawing, 30 px a metre. */
const y = (level: number) => 120 + (110 - level) * 30;

const text = (x: number, yy: number, s: string, extra = '') => `<text x="${x}" y="${yy}" ${extra}>${s}</text>`;

/** Long section of the Harrowgate auxiliary spillway chute and plain stilling basin (case 01). */

/** The hatch and arrow every sketch uses, and its paper. */
const DEFS = `<defs>
    <pattern id="hatch" width="10" height="10" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
      <line x1="0" y1="0" x2="0" y2="10" stroke="#9a958a" stroke-width="1.2"/>
    </pattern>
    <marker id="arrow" markerWidth="10" markerHeight="10" refX="9" refY="5" orient="auto-start-reverse">
      <path d="M0,0 L10,5 L0,10 z" fill="#222"/>
    </marker>
  </defs>
  <rect width="${W}" height="${H}" fill="#fbfaf6"/>`;

function harrowgateSketch(): string {
  const crest = { x: 210, y: y(105.3) };
  const toe = { x: 560, y: y(95.5) };
  const basinEnd = 900;
  const tail = y(101.35);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
${DEFS}
  <g font-family="DejaVu Sans, Liberation Sans, sans-serif" fill="#222">
    ${text(40, 52, 'Harrowgate auxiliary spillway — basin sketch (demo)', 'font-size="30" font-weight="bold"')}
    ${text(40, 84, 'Long section along the chute centre line, design flood 280 m³/s · not to scale vertically', 'font-size="17" fill="#555"')}
  </g>
  <!-- reservoir -->
  <path d="M20,${y(108.35)} L${crest.x - 60},${y(108.35)} L${crest.x - 60},${y(94)} L20,${y(94)} Z" fill="#cfe0ee"/>
  <!-- dam body, chute and apron slab -->
  <path d="M${crest.x - 60},${y(94)} L${crest.x - 60},${crest.y + 30} Q${crest.x - 40},${crest.y} ${crest.x},${crest.y}
           Q${crest.x + 60},${crest.y} ${crest.x + 90},${crest.y + 45} L${toe.x - 30},${toe.y - 10} Q${toe.x - 10},${toe.y} ${toe.x + 20},${toe.y}
           L${basinEnd},${toe.y} L${basinEnd + 60},${y(96.2)} L1180,${y(96.2)} L1180,${y(94)} Z" fill="url(#hatch)" stroke="#222" stroke-width="3"/>
  <!-- flow on the chute, the jump and the tailwater -->
  <path d="M${crest.x - 60},${y(108.35)} Q${crest.x - 10},${y(108.2)} ${crest.x + 10},${crest.y - 25}
           Q${crest.x + 60},${crest.y - 18} ${crest.x + 90},${crest.y + 25} L${toe.x - 30},${toe.y - 34} Q${toe.x},${toe.y - 28} ${toe.x + 40},${toe.y - 27}
           C${toe.x + 110},${toe.y - 40} ${toe.x + 150},${tail + 20} ${toe.x + 230},${tail}
           L1180,${tail} L1180,${y(96.2)} L${basinEnd + 60},${y(96.2)} L${basinEnd},${toe.y} L${toe.x + 20},${toe.y} Q${toe.x - 10},${toe.y} ${toe.x - 30},${toe.y - 10}
           L${crest.x + 90},${crest.y + 45} Q${crest.x + 60},${crest.y} ${crest.x},${crest.y} Q${crest.x - 40},${crest.y} ${crest.x - 60},${crest.y + 30} Z" fill="#9fc3e0" fill-opacity="0.85"/>
  <!-- roller -->
  <g fill="none" stroke="#2d5f8a" stroke-width="2.5">
    <path d="M${toe.x + 70},${toe.y - 45} q30,-60 70,-40 q25,15 5,40"/>
    <path d="M${toe.x + 120},${toe.y - 80} q35,-60 75,-45 q25,15 5,45"/>
    <path d="M${toe.x + 170},${tail + 40} q30,-40 60,-25"/>
  </g>
  <!-- levels -->
  <g font-family="DejaVu Sans, Liberation Sans, sans-serif" font-size="16" fill="#222">
    <line x1="20" y1="${y(108.5)}" x2="${toe.x + 40}" y2="${y(108.5)}" stroke="#b0452f" stroke-width="2" stroke-dasharray="10 6"/>
    ${text(240, y(108.5) - 10, 'Energy level, design flood 108.50 m AOD', 'fill="#b0452f"')}
    ${text(30, y(108.35) + 28, 'Reservoir')}
    ${text(30, y(108.35) + 48, '108.35 m AOD')}
    ${text(crest.x + 30, crest.y - 40, 'Crest')}
    <line x1="${toe.x - 20}" y1="${y(96.5)}" x2="${basinEnd}" y2="${y(96.5)}" stroke="#555" stroke-width="1.5" stroke-dasharray="6 5"/>
    ${text(toe.x + 250, y(96.5) - 8, 'Feasibility apron 96.50 m AOD (HR-S-104 rev B)', 'fill="#555" font-size="14"')}
    ${text(toe.x + 40, toe.y + 32, 'Apron 95.50 m AOD (recommended), basin 25 m wide', 'font-weight="bold"')}
    ${text(870, tail - 12, 'Tailwater 101.35 m AOD at 280 m³/s')}
    ${text(870, tail + 22, 'gauge 27014 · rating in the attached CSV', 'font-size="14" fill="#333"')}
    ${text(1010, tail + 70, 'River Aldmere', 'font-style="italic" fill="#2d5f8a"')}
    ${text(330, 420, 'Chute 38 m, k = 0.05', 'transform="rotate(40 330 420)"')}
    ${text(toe.x + 20, y(104.2), 'Hydraulic jump')}
    ${text(toe.x + 20, y(104.2) + 20, 'Fr₁ ≈ 5.6', 'font-size="14" fill="#555"')}
  </g>
  <!-- basin length -->
  <g stroke="#222" stroke-width="1.5">
    <line x1="${toe.x}" y1="${toe.y + 60}" x2="${basinEnd}" y2="${toe.y + 60}" marker-start="url(#arrow)" marker-end="url(#arrow)"/>
    <line x1="${toe.x}" y1="${toe.y + 45}" x2="${toe.x}" y2="${toe.y + 75}"/>
    <line x1="${basinEnd}" y1="${toe.y + 45}" x2="${basinEnd}" y2="${toe.y + 75}"/>
  </g>
  <g font-family="DejaVu Sans, Liberation Sans, sans-serif" fill="#222">
    ${text(toe.x + 95, toe.y + 85, 'Lj ≈ 6.1 y₂ ≈ 34 m (plain basin, no blocks or sill)', 'font-size="15"')}
    ${text(40, H - 22, 'Kestrel Weir Consulting · KWC-2291 · invented demo data, not a survey drawing', 'font-size="14" fill="#777"')}
  </g>
</svg>`;
}

/** Long section of the Kilnbarrow Lane culvert outlet and its depressed apron (case 02). */
function kilnbarrowSketch(): string {
  // Levels relative to the beck bed (0 m), 90 px a metre.
  const ky = (level: number) => 430 - level * 90;
  const outlet = 430;
  const apronEnd = 900;
  const rampEnd = 1010;
  const font = 'font-family="DejaVu Sans, Liberation Sans, sans-serif"';
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
${DEFS}
  <g ${font} fill="#222">
    ${text(40, 52, 'Kilnbarrow Lane culvert — outlet apron sketch (demo)', 'font-size="30" font-weight="bold"')}
    ${text(40, 84, 'Long section on the centre line, design flow 14.0 m³/s · levels from the beck bed · not to scale', 'font-size="17" fill="#555"')}
  </g>
  <!-- water: barrel flow, jump, tailwater -->
  <path d="M40,${ky(1.4)} L${outlet},${ky(0.4)} L${outlet + 60},${ky(-0.2)}
           C${outlet + 150},${ky(-0.15)} ${outlet + 190},${ky(1.6)} ${outlet + 300},${ky(1.68)}
           L1180,${ky(1.68)} L1180,${ky(0)} L${rampEnd},${ky(0)} L${apronEnd},${ky(-0.6)} L${outlet},${ky(-0.6)} L${outlet},${ky(0)} L40,${ky(1.0)} Z" fill="#9fc3e0" fill-opacity="0.85"/>
  <!-- barrel: soffit and invert -->
  <path d="M40,${ky(2.6)} L${outlet},${ky(1.6)}" stroke="#222" stroke-width="4" fill="none"/>
  <path d="M40,${ky(1.0)} L${outlet},${ky(0)} L${outlet},${ky(-0.6)} L${apronEnd},${ky(-0.6)} L${rampEnd},${ky(0)} L1180,${ky(0)} L1180,${ky(-2)} L40,${ky(-2)} Z" fill="url(#hatch)" stroke="#222" stroke-width="3"/>
  <rect x="${outlet - 6}" y="${ky(2.6)}" width="12" height="${ky(1.6) - ky(2.6)}" fill="#777"/>
  <g fill="none" stroke="#2d5f8a" stroke-width="2.5">
    <path d="M${outlet + 90},${ky(0.2)} q30,-60 70,-40 q25,15 5,40"/>
    <path d="M${outlet + 150},${ky(0.9)} q30,-50 65,-35 q20,12 5,35"/>
  </g>
  <g ${font} font-size="16" fill="#222">
    ${text(90, ky(2.85), 'Box culvert 3.0 m wide at 4 %', 'transform="rotate(12 90 ${ky(2.85)})"')}
    ${text(outlet - 330, ky(0.05), 'Outlet: y₁ = 0.40 m, Fr₁ ≈ 5.3', 'font-size="15"')}
    ${text(outlet + 120, ky(2.6), 'Hydraulic jump, y₂ ≈ 2.2 m')}
    ${text(outlet + 330, ky(1.68) - 12, 'Tailwater: normal depth of the beck ≈ 1.68 m')}
    ${text(outlet + 60, ky(-0.6) + 32, 'Apron 0.60 m below the bed · 3.0 m base, 1.5H:1V sides', 'font-weight="bold" font-size="15"')}
    ${text(apronEnd - 10, ky(-0.3) - 8, '1:4 ramp', 'font-size="14"')}
    ${text(rampEnd + 20, ky(0) + 30, 'Rock protection', 'font-size="14" fill="#555"')}
    ${text(1030, ky(1.0), 'Tarrowby Beck', 'font-style="italic" fill="#2d5f8a"')}
  </g>
  <g stroke="#222" stroke-width="1.5">
    <line x1="${outlet}" y1="${ky(-0.6) + 75}" x2="${apronEnd}" y2="${ky(-0.6) + 75}" marker-start="url(#arrow)" marker-end="url(#arrow)"/>
    <line x1="${outlet}" y1="${ky(-0.6) + 60}" x2="${outlet}" y2="${ky(-0.6) + 90}"/>
    <line x1="${apronEnd}" y1="${ky(-0.6) + 60}" x2="${apronEnd}" y2="${ky(-0.6) + 90}"/>
  </g>
  <g ${font} fill="#222">
    ${text(outlet + 110, ky(-0.6) + 100, 'Concrete apron and side lining 18 m (about 8 y₂)', 'font-size="15"')}
    ${text(40, H - 22, 'Kestrel Weir Consulting · KWC-2304 · invented demo data, not a construction drawing', 'font-size="14" fill="#777"')}
  </g>
</svg>`;
}

async function draw(name: string, svg: string): Promise<void> {
  const image = sharp(Buffer.from(svg));
  const bytes = name.endsWith('.jpg')
    ? await image.jpeg({ quality: 82, mozjpeg: true }).toBuffer()
    : await image.png({ palette: true, colours: 64, compressionLevel: 9, effort: 10 }).toBuffer();
  writeFileSync(path.join(FILES, name), bytes);
  console.log(`${name}: ${bytes.byteLength} bytes`);
}

await draw('harrowgate-basin-sketch.png', harrowgateSketch());
await draw('kilnbarrow-outlet-sketch.jpg', kilnbarrowSketch());
