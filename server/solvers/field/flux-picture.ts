// The field picture as SVG text, drawn from the mesh and the solution: flux lines as contours of the flux function
// ψ = r·Aφ in axisymmetry (the flux through a circle of radius r at height z is 2π·ψ) or ψ = Az in a planar model
// (the flux per metre of depth between two points is the difference of Az), so in both equal steps of ψ put equal
// flux between neighbouring lines; traced triangle by triangle (ψ is linear on each first-order triangle), over the
// core's cross-section filled grey and the conductors outlined.
import type { Outline } from './geo-builder.ts';
import type { TriangleMesh } from './mesh-reader.ts';

export interface FluxPictureInput {
  mesh: TriangleMesh;
  /** ψ = r·Aφ (axisymmetric) or Az (planar) at each node. */
  fluxFunction: Map<number, number>;
  core: Outline[];
  conductors: Outline[];
  /** The part of the r-z half-plane (axisymmetric) or the x-y plane (planar, rMin < 0) drawn (m). */
  view: { rMin?: number; rMax: number; zMin: number; zMax: number };
  /** A planar cross-section: no axis of revolution to draw. */
  planar?: boolean;
  title: string;
  /** Flux lines drawn (equal flux between neighbours). */
  lines?: number;
}

const WIDTH = 480;
const MARGIN = 24;

export function fluxPicture(p: FluxPictureInput): string {
  const rMin = p.view.rMin ?? 0;
  const scale = (WIDTH - 2 * MARGIN) / (p.view.rMax - rMin);
  const height = Math.round((p.view.zMax - p.view.zMin) * scale + 2 * MARGIN + 20);
  const x = (r: number) => (MARGIN + (r - rMin) * scale).toFixed(2);
  const y = (z: number) => (MARGIN + 20 + (p.view.zMax - z) * scale).toFixed(2);
  const inView = (r: number, z: number) => r >= rMin && r <= p.view.rMax && z >= p.view.zMin && z <= p.view.zMax;
  // Levels span the flux function over what is drawn, so the lines are spent where they can be seen.
  let [low, high] = [Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY];
  for (const [id, psi] of p.fluxFunction) {
    const at = p.mesh.nodes.get(id);
    if (!at || !inView(...at)) continue;
    low = Math.min(low, psi);
    high = Math.max(high, psi);
  }
  const count = p.lines ?? 32;
  const levels = Array.from({ length: count }, (_, i) => low + ((i + 0.5) * (high - low)) / count);
  const segments: string[] = [];
  for (const t of p.mesh.triangles) {
    const corners = t.nodes.map((id) => ({ at: p.mesh.nodes.get(id)!, psi: p.fluxFunction.get(id) ?? Number.NaN }));
    if (!corners.some((c) => inView(...c.at)) || corners.some((c) => Number.isNaN(c.psi))) continue;
    for (const level of levels) {
      const cuts: [number, number][] = [];
      for (let i = 0; i < 3; i++) {
        const [a, b] = [corners[i]!, corners[(i + 1) % 3]!];
        if ((a.psi - level) * (b.psi - level) < 0) {
          const s = (level - a.psi) / (b.psi - a.psi);
          cuts.push([a.at[0] + s * (b.at[0] - a.at[0]), a.at[1] + s * (b.at[1] - a.at[1])]);
        }
      }
      if (cuts.length === 2) segments.push(`M${x(cuts[0]![0])} ${y(cuts[0]![1])}L${x(cuts[1]![0])} ${y(cuts[1]![1])}`);
    }
  }
  const shape = (o: Outline) =>
    o.kind === 'circle'
      ? `<circle cx="${x(o.centre[0])}" cy="${y(o.centre[1])}" r="${(o.radius * scale).toFixed(2)}"/>`
      : `<polygon points="${o.corners.map(([r, z]) => `${x(r)},${y(z)}`).join(' ')}"/>`;
  const escape = (s: string) => s.replace(/[<>&]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;' })[c]!);
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${height}" viewBox="0 0 ${WIDTH} ${height}" font-family="sans-serif" font-size="12">`,
    `<rect width="100%" height="100%" fill="#fff"/>`,
    `<text x="${MARGIN}" y="16">${escape(p.title)}</text>`,
    `<defs><clipPath id="view"><rect x="${MARGIN}" y="${MARGIN + 20}" width="${WIDTH - 2 * MARGIN}" height="${height - 2 * MARGIN - 20}"/></clipPath></defs>`,
    `<g clip-path="url(#view)">`,
    `<g fill="#d9d9d9" stroke="#555" stroke-width="0.8">${p.core.map(shape).join('')}</g>`,
    `<g fill="#f3c79b" stroke="#a0522d" stroke-width="0.6">${p.conductors.map(shape).join('')}</g>`,
    `<path d="${segments.join('')}" fill="none" stroke="#1f4e9c" stroke-width="0.7"/>`,
    `</g>`,
    ...(p.planar
      ? [`<text x="${MARGIN}" y="${height - 6}">planar cross-section; ${count} flux lines, equal flux between neighbours</text>`]
      : [
          `<line x1="${x(0)}" y1="${MARGIN + 20}" x2="${x(0)}" y2="${height - MARGIN}" stroke="#000" stroke-dasharray="4 3"/>`,
          `<text x="${MARGIN}" y="${height - 6}">axis of revolution (dashed); ${count} flux lines, equal flux between neighbours</text>`,
        ]),
    '</svg>',
    '',
  ].join('\n');
}
