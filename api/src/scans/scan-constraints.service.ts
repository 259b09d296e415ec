import { BadRequestException, ConflictException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import {
  axisPrior, deltaChi2, EVIDENCE_PRIOR_NOTE, gridEvidence, gridPosterior, posteriorAxes, ScanGrid,
  type ScanConstraints, type ScanConstraintsQuery,
} from '@sixtyfold/shared';
import type { SessionUser } from '../common/session-user';
import { openQueryStream } from '../exports/query-stream';
import { LikelihoodSetsService } from '../likelihoods/likelihood-sets.service';
import { ScanResultsService } from './scan-results.service';

const finite = (x: number) => (Number.isFinite(x) ? x : null);

/**
 * What a grid scan's data allow under one likelihood set: the posterior over the grid with a
 * prior per axis, its marginals, credible intervals, best fit and evidence (`shared/src/statistics/`),
 * from the stored outputs alone. Failed, flagged and not yet computed points are left out and counted.
 */
@Injectable()
export class ScanConstraintsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly results: ScanResultsService,
    private readonly sets: LikelihoodSetsService,
  ) {}

  async constraints(user: SessionUser, id: number, q: ScanConstraintsQuery): Promise<ScanConstraints> {
    const scan = await this.results.readable(user, id);
    if (!scan.spec.axes) throw new ConflictException('This scan runs over a list of points: a posterior needs the prior volume of a grid');
    const likelihood = await this.sets.find(q.likelihood.key, q.likelihood.version);
    const names = scan.spec.axes.map((axis) => axis.parameter);
    const bad: Record<string, string[]> = {};
    for (const name of Object.keys(q.priors)) if (!names.includes(name)) bad[`prior.${name}`] = [`the scan has no axis ${name}; its axes are ${names.join(', ')}`];
    const pairOf = [q.x ?? names[0], q.y ?? names[1]];
    for (const [field, name] of [['x', q.x], ['y', q.y]] as const) if (name !== undefined && !names.includes(name)) bad[field] = [`the scan has no axis ${name}; its axes are ${names.join(', ')}`];
    if (names.length >= 2 && pairOf[0] === pairOf[1]) bad.y = ['x and y must be different axes'];
    if (Object.keys(bad).length) throw new BadRequestException({ message: Object.entries(bad).map(([k, v]) => `${k}: ${v.join('; ')}`).join('. '), fieldErrors: bad });

    const axes = posteriorAxes(scan.spec.axes).map((axis) => ({ ...axis, prior: q.priors[axis.name] ?? axisPrior(axis) }));
    const grid = new ScanGrid(scan.spec.axes);
    // NaN marks a point left out: failed, flagged, or not stored yet.
    const chi2 = new Float64Array(grid.size).fill(Number.NaN);
    const source = await openQueryStream(this.db, 'SELECT point_index, ns, r, alpha_s FROM scan_points WHERE scan_id = ? AND status = ?', [scan.id, 'ok'], { rowsAsArray: true });
    let completed = false;
    try {
      for await (const [index, ns, r, alphaS] of source.readable as AsyncIterable<[number, number, number, number | null]>) {
        const judged = deltaChi2(likelihood, { ns, r, alphaS });
        if (judged) chi2[Number(index)] = judged.deltaChi2;
      }
      completed = true;
    } finally {
      await source.close(completed);
    }
    const input = { axes, deltaChi2: chi2 };
    const pair = names.length >= 2 ? ([names.indexOf(pairOf[0]), names.indexOf(pairOf[1])] as [number, number]) : undefined;
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

  /** The 1-D marginals as CSV: axis, prior, value, mass, density. */
  static marginalsCsv(constraints: ScanConstraints): string {
    const lines = ['axis,prior,value,mass,density'];
    for (const m of constraints.marginals) m.values.forEach((v, i) => lines.push(`${m.axis},${m.prior},${v},${m.mass[i]},${m.density[i] ?? ''}`));
    return `${lines.join('\n')}\n`;
  }
}
