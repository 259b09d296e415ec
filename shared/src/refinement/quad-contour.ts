/**
 * A level line through one rectangular cell from its four corner values (marching squares):
 * where the field minus the level changes sign along an edge, the line meets that edge at the
 * linearly interpolated point. A cell with an unknown corner gives nothing (we do not know where
 * the line runs). A saddle (opposite corners on the same side) is resolved by the corners' mean,
 * as the centre's value of the bilinear interpolant (common practice in marching squares).
 *
 * Written here rather than taken from a contouring package because the cells of a refined mesh are
 * of different sizes and do not form one regular grid, which is what such packages take.
 */

/** Corner values in the order (x0, y0), (x1, y0), (x0, y1), (x1, y1): bit 0 is x upper, bit 1 is y upper. */
export type QuadCorners = readonly [number | null, number | null, number | null, number | null];

/** A cell: its box and corner values. */
export interface ContourQuad {
  x: readonly [number, number];
  y: readonly [number, number];
  corners: QuadCorners;
}

/** One piece of a level line: from (x0, y0) to (x1, y1). */
export type ContourSegment = [x0: number, y0: number, x1: number, y1: number];

/** The edges of a cell, each as its two corner indices (QuadCorners order), walked round the cell. */
const EDGES = [
  [0, 1], // bottom
  [1, 3], // right
  [3, 2], // top
  [2, 0], // left
] as const;

/** The pieces of the line field = level through one cell: none, one, or two (at a saddle). */
export function quadContour(quad: ContourQuad, level: number): ContourSegment[] {
  const f = quad.corners.map((v) => (v === null || !Number.isFinite(v) ? null : v - level));
  if (f.some((v) => v === null)) return [];
  const d = f as number[];
  const at = (corner: number): [number, number] => [quad.x[corner & 1], quad.y[(corner >> 1) & 1]];
  // Each edge whose ends lie on different sides (a corner exactly on the level counts as above).
  const crossings: [number, number][] = [];
  EDGES.forEach(([a, b]) => {
    if (d[a] < 0 === d[b] < 0) return;
    const t = d[a] / (d[a] - d[b]);
    const [xa, ya] = at(a);
    const [xb, yb] = at(b);
    crossings.push([xa + t * (xb - xa), ya + t * (yb - ya)]);
  });
  if (crossings.length === 2) return [[...crossings[0], ...crossings[1]]];
  if (crossings.length !== 4) return [];
  // A saddle: all four edges crossed. If the centre lies on the side of corner 0, corner 0's
  // region is joined to its opposite corner and the line cuts off corners 1 and 2; else it cuts off 0 and 3.
  const centreAbove = (d[0] + d[1] + d[2] + d[3]) / 4 >= 0;
  const joinsZero = centreAbove === d[0] >= 0;
  // Crossings in EDGES order: bottom, right, top, left. Corner 1 sits between bottom and right,
  // corner 2 between top and left; corner 0 between left and bottom, corner 3 between right and top.
  const [bottom, right, top, left] = crossings;
  return joinsZero
    ? [[...bottom, ...right], [...top, ...left]]
    : [[...left, ...bottom], [...right, ...top]];
}

/** The level line through many cells: every cell's pieces, in the cells' order. */
export function levelLine(quads: Iterable<ContourQuad>, level: number): ContourSegment[] {
  const out: ContourSegment[] = [];
  for (const quad of quads) out.push(...quadContour(quad, level));
  return out;
}

/**
 * Pieces joined into polylines where they meet end to end (ends equal to `tolerance`, as neighbouring
 * cells compute the same edge point from opposite ends), so a dashed line keeps its pattern. A closed
 * line comes back with its first point repeated at the end.
 */
export function joinSegments(segments: readonly ContourSegment[], tolerance = 1e-9): [number, number][][] {
  const key = (x: number, y: number) => `${Math.round(x / tolerance)},${Math.round(y / tolerance)}`;
  const atEnd = new Map<string, number[]>();
  segments.forEach(([x0, y0, x1, y1], k) => {
    for (const end of [key(x0, y0), key(x1, y1)]) atEnd.set(end, [...(atEnd.get(end) ?? []), k]);
  });
  const used = new Uint8Array(segments.length);
  // From a point, the unused piece that starts or ends there, walked away from it.
  const step = (x: number, y: number): [number, number] | null => {
    const k = atEnd.get(key(x, y))?.find((candidate) => !used[candidate]);
    if (k === undefined) return null;
    used[k] = 1;
    const [x0, y0, x1, y1] = segments[k];
    return key(x0, y0) === key(x, y) ? [x1, y1] : [x0, y0];
  };
  const lines: [number, number][][] = [];
  segments.forEach(([x0, y0, x1, y1], k) => {
    if (used[k]) return;
    used[k] = 1;
    const line: [number, number][] = [[x0, y0], [x1, y1]];
    for (let next = step(x1, y1); next; next = step(...next)) line.push(next);
    for (let previous = step(x0, y0); previous; previous = step(...previous)) line.unshift(previous);
    lines.push(line);
  });
  return lines;
}
