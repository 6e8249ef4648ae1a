/** One point of a curve and whether it belongs to the dashed (flagged) part. */
export interface FlaggedPoint {
  x: number;
  y: number;
  flagged: boolean;
}

/**
 * Split a curve into a solid part (points not flagged) and a dashed part (flagged points). Neighbours of flagged
 * points are repeated in the dashed part so the two lines meet; nulls break each line where the other one runs.
 */
export function splitByFlag(points: readonly FlaggedPoint[]): {
  plain: ([number, number] | null)[];
  flagged: ([number, number] | null)[];
} {
  const plain: ([number, number] | null)[] = [];
  const flagged: ([number, number] | null)[] = [];
  points.forEach((p, i) => {
    const value: [number, number] = [p.x, p.y];
    const bordersFlagged = !!points[i + 1]?.flagged || !!points[i - 1]?.flagged;
    plain.push(p.flagged ? null : value);
    flagged.push(p.flagged || bordersFlagged ? value : null);
  });
  return { plain, flagged };
}
