import { describe, expect, it } from 'vitest';
import { fluxPicture } from '../../../server/solvers/field/flux-picture.ts';
import {
  maxOfSimpleTable,
  readGlobalTable,
  readMsh2,
  readNodeTable,
  SolutionFormatError,
} from '../../../server/solvers/field/mesh-reader.ts';

// The readers of gmsh's MSH 2.2 mesh and GetDP's text tables, and the flux-line picture drawn from them, on a
// two-triangle square written by hand (the format as gmsh 4.8 writes it with Mesh.MshFileVersion = 2.2).

const MESH = `$MeshFormat
2.2 0 8
$EndMeshFormat
$Nodes
4
1 0 0 0
2 0.001 0 0
3 0.001 0.001 0
4 0 0.001 0
$EndNodes
$Elements
3
1 1 2 4 7 1 4
2 2 2 3 1 1 2 3
3 2 2 3 1 1 3 4
$EndElements
`;

describe('field readers', () => {
  it('reads nodes and triangles with their physical group, skipping other elements', () => {
    const mesh = readMsh2(MESH);
    expect(mesh.nodes.size).toBe(4);
    expect(mesh.nodes.get(3)).toEqual([0.001, 0.001]);
    expect(mesh.triangles).toEqual([
      { group: 3, nodes: [1, 2, 3] },
      { group: 3, nodes: [1, 3, 4] },
    ]);
  });

  it('refuses a mesh of another version, a short node list or a triangle naming a missing node', () => {
    expect(() => readMsh2(MESH.replace('2.2 0 8', '4.1 0 8'))).toThrow(SolutionFormatError);
    expect(() => readMsh2(MESH.replace('$Nodes\n4', '$Nodes\n5'))).toThrow(/announces 5 nodes/);
    expect(() => readMsh2(MESH.replace('3 2 2 3 1 1 3 4', '3 2 2 3 1 1 3 9'))).toThrow(/Bad triangle/);
  });

  it('reads node tables, global integrals (real part) and the largest element value', () => {
    expect(readNodeTable('2\n1 0.5\n2 -1e-3\n')).toEqual(
      new Map([
        [1, 0.5],
        [2, -1e-3],
      ]),
    );
    expect(() => readNodeTable('3\n1 0.5\n2 1\n')).toThrow(SolutionFormatError);
    expect(readGlobalTable('0 1.5e-3 0\n0 2.5e-3 1e-9\n', 2)).toEqual([1.5e-3, 2.5e-3]);
    expect(() => readGlobalTable('0 nan\n', 1)).toThrow(SolutionFormatError);
    expect(maxOfSimpleTable('1 0 0 0.2\n2 0 0 0.7\n3 0 0 0.1\n')).toBe(0.7);
  });

  it('draws flux lines where ψ crosses a level, and the outlines', () => {
    const mesh = readMsh2(MESH);
    // ψ rising with r: the flux lines are vertical.
    const fluxFunction = new Map([...mesh.nodes].map(([id, [r]]) => [id, r]));
    const svg = fluxPicture({
      mesh,
      fluxFunction,
      core: [
        {
          kind: 'polygon',
          corners: [
            [0, 0],
            [0.0005, 0],
            [0.0005, 0.001],
            [0, 0.001],
          ],
        },
      ],
      conductors: [{ kind: 'circle', centre: [0.0008, 0.0005], radius: 0.0001 }],
      view: { rMax: 0.001, zMin: 0, zMax: 0.001 },
      title: 'square <test>',
      lines: 4,
    });
    // Four levels, each crossing both triangles.
    expect(svg.match(/M[\d.]+ [\d.]+L/g)).toHaveLength(8);
    expect(svg).toContain('<circle');
    expect(svg).toContain('square &lt;test&gt;');
  });
});
