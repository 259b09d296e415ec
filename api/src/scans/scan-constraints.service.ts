import { BadRequestException, ConflictException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import {
  axisPrior, bayesFactor, EVIDENCE_PRIOR_NOTE, gridEvidence, gridPosterior, meshEvidence, meshPosterior, posteriorAxes, ScanGrid,
  type EvidenceComparison, type GridPosterior, type PosteriorAxis, type EvidenceComparisonQuery, type PointJudge, type ScanConstraints, type ScanConstraintsQuery,
} from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { openQueryStream } from '../exports/query-stream';
import { LikelihoodsService } from '../likelihoods/likelihoods.service';
import { ScanRefinementsService, type MergedChain } from './scan-refinements.service';
import { ScanResultsService } from './scan-results.service';

const finite = (x: number) => (Number.isFinite(x) ? x : null);

/** The stored outputs of a scan's OK points, as columns. */
interface StoredOutputs {
  index: number[];
  ns: number[];
  r: number[];
  alphaS: (number | null)[];
}

/** Each grid point's Δχ² under a set or uploaded regions; NaN marks a point left out (failed, flagged, or not stored yet). */
function judge(judgeOne: PointJudge, size: number, outputs: StoredOutputs): Float64Array {
  const chi2 = new Float64Array(size).fill(Number.NaN);
  outputs.index.forEach((i, k) => {
    const judged = judgeOne({ ns: outputs.ns[k], r: outputs.r[k], alphaS: outputs.alphaS[k] });
    if (judged) chi2[i] = judged.deltaChi2;
  });
  return chi2;
}

/** The level whose nodes the marginals were stated on: the one whose first axis has as many nodes. */
function marginalLevelOf(posterior: GridPosterior, chain: MergedChain): number {
  const nodes = posterior.marginals[0]?.values.length ?? 0;
  for (let level = chain.mesh.levels; level > 0; level--) if (chain.mesh.lattice.axes[0].length(level) === nodes) return level;
  return 0;
}

/**
 * What a grid scan's data allow under one likelihood (a set or uploaded regions): the posterior over the grid with a
 * prior per axis, its marginals, credible intervals, best fit and evidence (`shared/src/statistics/`),
 * from the stored outputs alone. Failed, flagged and not yet computed points are left out and counted.
 */
@Injectable()
export class ScanConstraintsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly results: ScanResultsService,
    private readonly likelihoods: LikelihoodsService,
    private readonly refinements: ScanRefinementsService,
  ) {}

  async constraints(user: SessionUser, id: number, q: ScanConstraintsQuery): Promise<ScanConstraints> {
    const asked = await this.results.readable(user, id);
    // A refined grid (or a level of its chain) answers on the merged mesh of parent and levels.
    const chain = await this.refinements.mergedChain(asked);
    const scan = chain?.parent ?? asked;
    if (!scan.spec.axes) throw new ConflictException('This scan runs over a list of points: a posterior needs the prior volume of a grid');
    const resolved = await this.likelihoods.resolve(user, q.likelihood);
    const likelihood = resolved.description;
    const names = scan.spec.axes.map((axis) => axis.parameter);
    const bad: Record<string, string[]> = {};
    for (const name of Object.keys(q.priors)) if (!names.includes(name)) bad[`prior.${name}`] = [`the scan has no axis ${name}; its axes are ${names.join(', ')}`];
    const pairOf = [q.x ?? names[0], q.y ?? names[1]];
    for (const [field, name] of [['x', q.x], ['y', q.y]] as const) if (name !== undefined && !names.includes(name)) bad[field] = [`the scan has no axis ${name}; its axes are ${names.join(', ')}`];
    if (names.length >= 2 && pairOf[0] === pairOf[1]) bad.y = ['x and y must be different axes'];
    if (Object.keys(bad).length) throw new BadRequestException({ message: Object.entries(bad).map(([k, v]) => `${k}: ${v.join('; ')}`).join('. '), fieldErrors: bad });

    const axes = posteriorAxes(scan.spec.axes).map((axis) => ({ ...axis, prior: q.priors[axis.name] ?? axisPrior(axis) }));
    const pair = names.length >= 2 ? ([names.indexOf(pairOf[0]), names.indexOf(pairOf[1])] as [number, number]) : undefined;
    if (chain) return this.mergedConstraints(asked.id, chain, resolved.judge, likelihood, axes, pair);
    const grid = new ScanGrid(scan.spec.axes);
    const chi2 = judge(resolved.judge, grid.size, await this.storedOutputs(scan.id));
    const input = { axes, deltaChi2: chi2 };
    const included = chi2.reduce((n, x) => (Number.isNaN(x) ? n : n + 1), 0);
    const priors = axes.map((axis) => ({ axis: axis.name, prior: axis.prior }));
    if (included === 0) {
      return { scanId: scan.id, likelihood, priors, marginals: [], constraints: [], pair: null, bestFit: null, excluded: { count: grid.size, priorFraction: 1 }, included: 0, evidence: null };
    }
    const posterior = gridPosterior(input, { pair });
    const evidence = gridEvidence(input);
    return {
      scanId: scan.id,
      likelihood,
      priors,
      marginals: posterior.marginals.map((m) => ({ ...m, density: m.density.map(finite) })),
      constraints: posterior.constraints,
      pair: posterior.pair && {
        x: posterior.pair.x, y: posterior.pair.y, xValues: posterior.pair.xValues, yValues: posterior.pair.yValues,
        density: Array.from(posterior.pair.density, finite), contourDensity: posterior.pair.contourDensity,
      },
      bestFit: { pointIndex: posterior.bestFit.index, deltaChi2: posterior.bestFit.deltaChi2, inputs: posterior.bestFit.point },
      excluded: posterior.excluded,
      included: posterior.included,
      evidence: { z: evidence.z, lnZ: evidence.lnZ, lnZHalf: evidence.lnZHalf, lnZError: evidence.lnZError, note: EVIDENCE_PRIOR_NOTE },
    };
  }

  /**
   * The constraints on a refinement chain's multi-resolution mesh (`meshPosterior`, `meshEvidence`):
   * each leaf weighed by its prior volume with the mean of its corners' L; the marginals on the
   * finest level's values. Failed and flagged nodes are left out and counted, as on a grid.
   */
  private async mergedConstraints(
    scanId: number,
    chain: MergedChain,
    judgeOne: PointJudge,
    likelihood: ScanConstraints['likelihood'],
    axes: PosteriorAxis[],
    pair: [number, number] | undefined,
  ): Promise<ScanConstraints> {
    const origins = new Map<string, { scanId: number; pointIndex: number }>();
    const chi2 = await this.refinements.nodeValues(chain, (row) => judgeOne({ ns: row.ns, r: row.r, alphaS: row.alpha_s })?.deltaChi2 ?? null, 'NULL', origins);
    const priors = axes.map((axis) => ({ axis: axis.name, prior: axis.prior ?? axisPrior(axis) }));
    const points = chain.parent.totalPoints + chain.levels.reduce((n, level) => n + level.totalPoints, 0);
    const refinement = { parentScanId: chain.parent.id, levelScanIds: chain.levels.map((level) => level.id), points, marginalLevel: 0 };
    if (![...chi2.values()].some((d) => d !== null)) {
      return { scanId, likelihood, priors, marginals: [], constraints: [], pair: null, bestFit: null, excluded: { count: points, priorFraction: 1 }, included: 0, evidence: null, refinement };
    }
    const chosen = axes.map((axis) => axis.prior);
    const posterior = meshPosterior(chain.mesh, chi2, { pair, priors: chosen });
    const evidence = meshEvidence(chain.mesh, chi2, chosen);
    const bestKey = [...chi2.entries()].reduce((best, entry) => (entry[1] !== null && (best[1] === null || entry[1] < best[1]) ? entry : best))[0];
    const origin = origins.get(bestKey)!;
    return {
      scanId,
      likelihood,
      priors,
      marginals: posterior.marginals.map((m) => ({ ...m, density: m.density.map(finite) })),
      constraints: posterior.constraints,
      pair: posterior.pair && {
        x: posterior.pair.x, y: posterior.pair.y, xValues: posterior.pair.xValues, yValues: posterior.pair.yValues,
        density: Array.from(posterior.pair.density, finite), contourDensity: posterior.pair.contourDensity,
      },
      bestFit: { pointIndex: origin.pointIndex, scanId: origin.scanId, deltaChi2: posterior.bestFit.deltaChi2, inputs: posterior.bestFit.point },
      excluded: posterior.excluded,
      included: posterior.included,
      evidence: { z: evidence.z, lnZ: evidence.lnZ, lnZHalf: evidence.lnZHalf, lnZError: evidence.lnZError, note: EVIDENCE_PRIOR_NOTE },
      refinement: { ...refinement, marginalLevel: marginalLevelOf(posterior, chain) },
    };
  }

  /**
   * The evidence of each scan under each set, with ln B against the reference scan (the first
   * unless named), ranked best first. Each scan's points are read once for all the sets.
   */
  async compareEvidence(user: SessionUser, q: EvidenceComparisonQuery): Promise<EvidenceComparison> {
    const scans = [];
    for (const id of q.ids) {
      const scan = await this.results.readable(user, id);
      if (!scan.spec.axes) throw new ConflictException(`Scan ${id} runs over a list of points: its evidence needs the prior volume of a grid`);
      scans.push({ scan, axes: posteriorAxes(scan.spec.axes), size: new ScanGrid(scan.spec.axes).size, outputs: await this.storedOutputs(scan.id) });
    }
    const referenceId = q.reference ?? q.ids[0];
    const sets = [];
    for (const ref of q.likelihoods) {
      const { description: likelihood, judge: judgeOne } = await this.likelihoods.resolve(user, ref, 'likelihoods');
      const rows = scans.map(({ scan, axes, size, outputs }) => {
        const chi2 = judge(judgeOne, size, outputs);
        const included = chi2.reduce((n, x) => (Number.isNaN(x) ? n : n + 1), 0);
        const evidence = included > 0 ? gridEvidence({ axes, deltaChi2: chi2 }) : null;
        return { scanId: scan.id, name: scan.name, lnZ: evidence?.lnZ ?? null, lnZError: evidence?.lnZError ?? null, included, excluded: size - included };
      });
      const reference = rows.find((row) => row.scanId === referenceId)!;
      const ranked = [...rows].sort((a, b) => (b.lnZ ?? -Infinity) - (a.lnZ ?? -Infinity));
      sets.push({
        likelihood,
        scans: ranked.map((row, k) => {
          const factor = row.lnZ !== null && reference.lnZ !== null ? bayesFactor(row.lnZ, reference.lnZ) : null;
          const verdict = factor && (row.scanId === referenceId ? 'the reference' : factor.words.replace('the model', `scan ${row.scanId}`).replace('the reference', `scan ${referenceId}`));
          return { ...row, rank: k + 1, lnB: factor?.lnB ?? null, twoLnB: factor?.twoLnB ?? null, verdict: verdict ?? null };
        }),
      });
    }
    return { referenceId, note: EVIDENCE_PRIOR_NOTE, sets };
  }

  /** The OK points' n_s, r and α_s, read in one pass as columns. */
  private async storedOutputs(scanId: number): Promise<StoredOutputs> {
    const index: number[] = [];
    const ns: number[] = [];
    const r: number[] = [];
    const alphaS: (number | null)[] = [];
    const source = await openQueryStream(this.db, 'SELECT point_index, ns, r, alpha_s FROM scan_points WHERE scan_id = ? AND status = ?', [scanId, 'ok'], { rowsAsArray: true });
    let completed = false;
    try {
      for await (const row of source.readable as AsyncIterable<[number, number, number, number | null]>) {
        index.push(Number(row[0]));
        ns.push(row[1]);
        r.push(row[2]);
        alphaS.push(row[3]);
      }
      completed = true;
    } finally {
      await source.close(completed);
    }
    return { index, ns, r, alphaS };
  }

  /** The 1-D marginals as CSV: axis, prior, value, mass, density. */
  static marginalsCsv(constraints: ScanConstraints): string {
    const lines = ['axis,prior,value,mass,density'];
    for (const m of constraints.marginals) m.values.forEach((v, i) => lines.push(`${m.axis},${m.prior},${v},${m.mass[i]},${m.density[i] ?? ''}`));
    return `${lines.join('\n')}\n`;
  }
}
