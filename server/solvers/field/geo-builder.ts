// Writes a gmsh .geo (built-in kernel) from polygons and circles in the r-z half-plane. Points and segments are shared
// by coordinates, so two regions that meet along the same corner points get one common line and a conforming mesh
// without boolean operations, and every surface's physical group is known by construction (no renumbering).

/** A closed outline: a polygon (corners in order) or a circle. Lengths in m. */
export type Outline = ({ kind: 'polygon'; corners: [number, number][] } | { kind: 'circle'; centre: [number, number]; radius: number }) & {
  /** Element size on this outline (m); otherwise the model's sizeAt. */
  size?: number;
};

export interface Surface {
  outline: Outline;
  holes?: Outline[];
  /** Physical group number. */
  group: number;
}

export interface GeoInput {
  surfaces: Surface[];
  /** Element size wanted at a point of an outline (m). */
  sizeAt(r: number, z: number): number;
  /** Physical curve groups: a segment whose two ends both satisfy the test joins the group. */
  curveGroups: { group: number; holds(r: number, z: number): boolean }[];
}

const n = (x: number) => x.toPrecision(12);
const key = (r: number, z: number) => `${r.toPrecision(10)},${z.toPrecision(10)}`;

export function buildGeo(input: GeoInput): string {
  const lines = ['// Gapwright axisymmetric model (generated); r along x, z along y, lengths in m'];
  const points = new Map<string, { id: number; r: number; z: number }>();
  const segments = new Map<string, number>();
  const straight: { id: number; a: [number, number]; b: [number, number] }[] = [];
  let nextId = 1;
  let outlineSize: number | undefined;
  const point = (r: number, z: number) => {
    const k = key(r, z);
    let p = points.get(k);
    if (!p) {
      p = { id: nextId++, r, z };
      points.set(k, p);
      lines.push(`Point(${p.id}) = {${n(r)}, ${n(z)}, 0, ${n(outlineSize ?? input.sizeAt(r, z))}};`);
    }
    return p.id;
  };
  /** Signed line id from a to b; the reverse of an existing line is its negative. */
  const segment = (a: [number, number], b: [number, number]) => {
    const [pa, pb] = [point(...a), point(...b)];
    const existing = segments.get(`${pa}>${pb}`) ?? -(segments.get(`${pb}>${pa}`) ?? 0);
    if (existing) return existing;
    const id = nextId++;
    segments.set(`${pa}>${pb}`, id);
    lines.push(`Line(${id}) = {${pa}, ${pb}};`);
    straight.push({ id, a, b });
    return id;
  };
  const circles = new Map<string, number>();
  const loop = (outline: Outline): number => {
    outlineSize = outline.size;
    let ids: number[];
    if (outline.kind === 'polygon') {
      const c = outline.corners;
      ids = c.map((a, i) => segment(a, c[(i + 1) % c.length]!));
    } else {
      const [r0, z0] = outline.centre;
      const k = `${key(r0, z0)}:${outline.radius}`;
      const known = circles.get(k);
      if (known) return known;
      const centre = nextId++;
      lines.push(`Point(${centre}) = {${n(r0)}, ${n(z0)}, 0, ${n(outline.radius)}};`);
      const rim = [0, 1, 2, 3].map((q) => {
        const angle = (q * Math.PI) / 2;
        return point(r0 + outline.radius * Math.cos(angle), z0 + outline.radius * Math.sin(angle));
      });
      ids = rim.map((p, q) => {
        const id = nextId++;
        lines.push(`Circle(${id}) = {${p}, ${centre}, ${rim[(q + 1) % 4]}};`);
        return id;
      });
    }
    const id = nextId++;
    lines.push(`Curve Loop(${id}) = {${ids.join(', ')}};`);
    if (outline.kind === 'circle') circles.set(`${key(...outline.centre)}:${outline.radius}`, id);
    return id;
  };
  const groups = new Map<number, number[]>();
  for (const s of input.surfaces) {
    const loops = [loop(s.outline), ...(s.holes ?? []).map(loop)];
    const id = nextId++;
    lines.push(`Plane Surface(${id}) = {${loops.join(', ')}};`);
    groups.set(s.group, [...(groups.get(s.group) ?? []), id]);
  }
  for (const [group, ids] of groups) lines.push(`Physical Surface(${group}) = {${ids.join(', ')}};`);
  for (const { group, holds } of input.curveGroups) {
    const ids = straight.filter((l) => holds(...l.a) && holds(...l.b)).map((l) => l.id);
    if (ids.length) lines.push(`Physical Curve(${group}) = {${ids.join(', ')}};`);
  }
  lines.push('Mesh.MshFileVersion = 2.2;', 'Mesh.CharacteristicLengthExtendFromBoundary = 1;', '');
  return lines.join('\n');
}
