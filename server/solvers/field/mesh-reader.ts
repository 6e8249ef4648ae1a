// Readers for gmsh's MSH 2.2 text mesh (nodes and first-order triangles with their physical group) and GetDP's text
// outputs (NodeTable: node number and value; Table of a global quantity; SimpleTable of element values). A file that
// does not have the expected shape is an error saying which, never a silent zero.

export interface TriangleMesh {
  /** Node coordinates by node number (x = r, y = z). */
  nodes: Map<number, [number, number]>;
  triangles: { group: number; nodes: [number, number, number] }[];
}

export class SolutionFormatError extends Error {
  override name = 'SolutionFormatError';
}

function section(text: string, name: string): string[] {
  const start = text.indexOf(`$${name}`);
  const end = text.indexOf(`$End${name}`, start);
  if (start < 0 || end < 0) throw new SolutionFormatError(`The mesh has no ${name} section.`);
  return text
    .slice(start, end)
    .split('\n')
    .slice(1)
    .map((l) => l.trim())
    .filter(Boolean);
}

export function readMsh2(text: string): TriangleMesh {
  const format = section(text, 'MeshFormat')[0]?.split(/\s+/);
  if (!format || format[0] !== '2.2' || format[1] !== '0') throw new SolutionFormatError('The mesh is not MSH 2.2 text.');
  const nodeLines = section(text, 'Nodes');
  const nodes = new Map<number, [number, number]>();
  for (const line of nodeLines.slice(1)) {
    const [id, x, y] = line.split(/\s+/).map(Number);
    if (!Number.isFinite(id) || !Number.isFinite(x) || !Number.isFinite(y)) throw new SolutionFormatError(`Bad node line "${line}".`);
    nodes.set(id!, [x!, y!]);
  }
  if (nodes.size !== Number(nodeLines[0]))
    throw new SolutionFormatError(`The mesh announces ${nodeLines[0]} nodes but lists ${nodes.size}.`);
  const triangles: TriangleMesh['triangles'] = [];
  for (const line of section(text, 'Elements').slice(1)) {
    const f = line.split(/\s+/).map(Number);
    if (f[1] !== 2) continue; // only first-order triangles carry the picture
    const tags = f[2]!;
    const corners = f.slice(3 + tags, 6 + tags) as [number, number, number];
    if (corners.length !== 3 || corners.some((c) => !nodes.has(c))) throw new SolutionFormatError(`Bad triangle line "${line}".`);
    triangles.push({ group: f[3]!, nodes: corners });
  }
  return { nodes, triangles };
}

/** GetDP `Format NodeTable`: a count, then "node value" lines (real values). */
export function readNodeTable(text: string): Map<number, number> {
  const lines = text.trim().split('\n');
  const count = Number(lines[0]);
  const values = new Map<number, number>();
  for (const line of lines.slice(1)) {
    const [id, value] = line.trim().split(/\s+/).map(Number);
    if (!Number.isFinite(id) || !Number.isFinite(value)) throw new SolutionFormatError(`Bad node value line "${line}".`);
    values.set(id!, value!);
  }
  if (!(count > 0) || values.size !== count)
    throw new SolutionFormatError(`The node table announces ${lines[0]} values but lists ${values.size}.`);
  return values;
}

/**
 * GetDP `Format Table` of `OnGlobal` integrals: one line per Print ("0 value" for a real quantity, "0 re im" for a
 * complex one); returns the real part of each line, in order.
 */
export function readGlobalTable(text: string, expected: number): number[] {
  const values = text
    .trim()
    .split('\n')
    .map((line) => Number(line.trim().split(/\s+/)[1]));
  if (values.length !== expected || values.some((v) => !Number.isFinite(v)))
    throw new SolutionFormatError(`Expected ${expected} integral values, read ${values.length}: "${text.slice(0, 80)}".`);
  return values;
}

/** The largest last number of a `Format SimpleTable` of one element value per line. */
export function maxOfSimpleTable(text: string): number {
  let max = Number.NEGATIVE_INFINITY;
  for (const line of text.trim().split('\n')) {
    const v = Number(line.trim().split(/\s+/).at(-1));
    if (!Number.isFinite(v)) throw new SolutionFormatError(`Bad element value line "${line}".`);
    if (v > max) max = v;
  }
  if (!Number.isFinite(max)) throw new SolutionFormatError('The element table is empty.');
  return max;
}
