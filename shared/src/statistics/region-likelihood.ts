import type { RegionVertex } from '../uploads/constraint-region.schema.js';
import { deltaChi2Threshold } from './delta-chi2.js';

/** One uploaded contour: a closed polygon in the (n_s, r) plane and its confidence level (0–1). */
export interface ContourRegion {
  confidenceLevel: number;
  vertices: readonly RegionVertex[];
}

export interface RegionDeltaChi2 {
  deltaChi2: number;
  /** The widest region that holds the point (its confidence level), or null outside them all. */
  insideLevel: number | null;
  /** True outside the outermost region, where Δχ² is extrapolated, e.g. "outside the 95% region". */
  outside: boolean;
}

/**
 * A group's nested contours for one data set used as a likelihood. Each contour's Δχ² is the χ²
 * quantile of its level in two parameters (68.27% → 2.30, 95.45% → 6.18). The rule between them:
 * √Δχ² (the region's "number of σ") grows linearly with the point's distance, which is exact for a
 * circular Gaussian:
 * - inside the innermost contour: √Δχ² = √t₁ · d_c / (d_c + d₁), from 0 at its centroid;
 * - between contours i and i+1: √Δχ² = √tᵢ + (√tᵢ₊₁ − √tᵢ) · dᵢ / (dᵢ + dᵢ₊₁);
 * - outside the outermost n: √Δχ² = √tₙ · d_c / (d_c − dₙ), the same slope carried on, and flagged `outside`;
 * with d_c the distance to the innermost contour's centroid and dᵢ the distance to contour i's outline.
 */
export class RegionLikelihood {
  private readonly contours: { root: number; level: number; vertices: readonly RegionVertex[] }[];
  private readonly centre: RegionVertex;

  constructor(regions: readonly ContourRegion[]) {
    if (regions.length === 0) throw new RangeError('a region likelihood needs at least one contour');
    const sorted = [...regions].sort((a, b) => a.confidenceLevel - b.confidenceLevel);
    sorted.forEach((region, i) => {
      if (!(region.confidenceLevel > 0 && region.confidenceLevel < 1)) throw new RangeError('a contour\'s confidence level lies strictly between 0 and 1');
      if (region.vertices.length < 3) throw new RangeError('a contour needs at least three vertices');
      if (i > 0 && region.confidenceLevel === sorted[i - 1].confidenceLevel) throw new RangeError(`two contours share the level ${region.confidenceLevel}`);
    });
    this.contours = sorted.map((region) => ({
      root: Math.sqrt(deltaChi2Threshold(region.confidenceLevel, 2)),
      level: region.confidenceLevel,
      vertices: region.vertices,
    }));
    // The rule between two contours assumes the wider one encloses the narrower one.
    for (let i = 1; i < sorted.length; i++) {
      if (!sorted[i - 1].vertices.every((vertex) => insidePolygon(vertex, sorted[i].vertices))) {
        throw new RangeError(`the ${percent(sorted[i - 1].confidenceLevel)} contour is not inside the ${percent(sorted[i].confidenceLevel)} contour; the contours must be nested`);
      }
    }
    this.centre = polygonCentroid(sorted[0].vertices);
    if (!insidePolygon(this.centre, sorted[0].vertices)) {
      throw new RangeError('the innermost contour\'s centroid lies outside it; the interpolation needs a centre inside');
    }
  }

  at(point: RegionVertex): RegionDeltaChi2 {
    const fromCentre = Math.hypot(point.ns - this.centre.ns, point.r - this.centre.r);
    const innermost = this.contours.findIndex((contour) => insidePolygon(point, contour.vertices));
    if (innermost === 0) {
      const { root, level, vertices } = this.contours[0];
      const toEdge = distanceToOutline(point, vertices);
      const sigmas = fromCentre + toEdge === 0 ? 0 : (root * fromCentre) / (fromCentre + toEdge);
      return { deltaChi2: sigmas * sigmas, insideLevel: level, outside: false };
    }
    if (innermost > 0) {
      const inner = this.contours[innermost - 1];
      const outer = this.contours[innermost];
      const toInner = distanceToOutline(point, inner.vertices);
      const toOuter = distanceToOutline(point, outer.vertices);
      const sigmas = inner.root + ((outer.root - inner.root) * toInner) / (toInner + toOuter);
      return { deltaChi2: sigmas * sigmas, insideLevel: outer.level, outside: false };
    }
    const outermost = this.contours[this.contours.length - 1];
    const toEdge = distanceToOutline(point, outermost.vertices);
    const sigmas = (outermost.root * fromCentre) / (fromCentre - toEdge);
    return { deltaChi2: sigmas * sigmas, insideLevel: null, outside: true };
  }
}

const percent = (level: number) => `${Number((level * 100).toPrecision(4))}%`;

/** Even-odd rule: whether a point lies inside a closed polygon (on an edge counts as inside). */
export function insidePolygon(point: RegionVertex, vertices: readonly RegionVertex[]): boolean {
  if (distanceToOutline(point, vertices) === 0) return true;
  let inside = false;
  for (let i = 0, j = vertices.length - 1; i < vertices.length; j = i++) {
    const a = vertices[i];
    const b = vertices[j];
    if (a.r > point.r !== b.r > point.r && point.ns < ((b.ns - a.ns) * (point.r - a.r)) / (b.r - a.r) + a.ns) inside = !inside;
  }
  return inside;
}

/** The shortest distance from a point to a closed polygon's outline. */
export function distanceToOutline(point: RegionVertex, vertices: readonly RegionVertex[]): number {
  let best = Infinity;
  for (let i = 0, j = vertices.length - 1; i < vertices.length; j = i++) {
    const a = vertices[j];
    const b = vertices[i];
    const dx = b.ns - a.ns;
    const dy = b.r - a.r;
    const lengthSquared = dx * dx + dy * dy;
    const t = lengthSquared === 0 ? 0 : Math.min(1, Math.max(0, ((point.ns - a.ns) * dx + (point.r - a.r) * dy) / lengthSquared));
    best = Math.min(best, Math.hypot(point.ns - (a.ns + t * dx), point.r - (a.r + t * dy)));
  }
  return best;
}

/** The area centroid of a closed polygon (shoelace formula); the vertex mean when the area is zero. */
export function polygonCentroid(vertices: readonly RegionVertex[]): RegionVertex {
  let area = 0;
  let ns = 0;
  let r = 0;
  for (let i = 0, j = vertices.length - 1; i < vertices.length; j = i++) {
    const cross = vertices[j].ns * vertices[i].r - vertices[i].ns * vertices[j].r;
    area += cross;
    ns += (vertices[j].ns + vertices[i].ns) * cross;
    r += (vertices[j].r + vertices[i].r) * cross;
  }
  if (area === 0) {
    return { ns: vertices.reduce((s, v) => s + v.ns, 0) / vertices.length, r: vertices.reduce((s, v) => s + v.r, 0) / vertices.length };
  }
  return { ns: ns / (3 * area), r: r / (3 * area) };
}
