import { createHash } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { canonicalJson, resolvedEngineOptions, type BuildInfo, type ScanProvenance, type ScanProvenanceAnswer, type StoredScanSpec } from '@sixtyfold/shared';
import { ScanChunkRun } from './entities/scan-chunk-run.entity';
import type { Scan } from './entities/scan.entity';

/** SHA-256 (hex) of the stored spec's canonical JSON (`canonicalJson`: keys sorted at every depth, no whitespace). */
export function specSha256(spec: StoredScanSpec): string {
  return createHash('sha256').update(canonicalJson(spec)).digest('hex');
}

/** What a submission records: this build, the engine's resolved settings for the spec, and the spec's hash. */
export function submissionProvenance(build: BuildInfo, spec: StoredScanSpec): ScanProvenance {
  return { ...build, specSha256: specSha256(spec), engineOptions: resolvedEngineOptions(spec) };
}

/**
 * Everything recorded of what computed a scan: its submission record and its chunk runs, listed
 * in order and summed per worker. The one reader for the provenance route, the exports and the archives.
 */
export async function readScanProvenance(manager: EntityManager, scan: Pick<Scan, 'id' | 'provenance'>): Promise<ScanProvenanceAnswer> {
  const rows = await manager.getRepository(ScanChunkRun).find({ where: { scanId: scan.id }, order: { startedAt: 'ASC', id: 'ASC' } });
  const runs = rows.map((r) => ({
    chunk: r.chunk, start: r.start, end: r.end, worker: r.worker, engineVersion: r.engineVersion, commit: r.commit, node: r.node,
    pointTimeLimitMs: r.pointTimeLimitMs, startedAt: r.startedAt.toISOString(), finishedAt: r.finishedAt.toISOString(),
  }));
  const workers = new Map<string, ScanProvenanceAnswer['workers'][number]>();
  for (const run of runs) {
    // One line per process and build: a worker restarted on a new build under the same pid is another line.
    const key = `${run.worker}|${run.engineVersion}|${run.commit}|${run.node}`;
    const seen = workers.get(key);
    if (seen) {
      seen.runs += 1;
      seen.points += run.end - run.start;
      if (run.finishedAt > seen.lastFinishedAt) seen.lastFinishedAt = run.finishedAt;
    } else {
      workers.set(key, {
        worker: run.worker, engineVersion: run.engineVersion, commit: run.commit, node: run.node, runs: 1, points: run.end - run.start,
        firstStartedAt: run.startedAt, lastFinishedAt: run.finishedAt,
      });
    }
  }
  return { scanId: scan.id, recorded: scan.provenance, runsRecorded: scan.provenance !== null || runs.length > 0, workers: [...workers.values()], runs };
}

/** Provenance as text lines (without a comment mark), for the CSV export's header. */
export function provenanceLines(p: ScanProvenanceAnswer): string[] {
  const lines: string[] = [];
  if (!p.recorded) lines.push('provenance: not recorded (the scan was stored before Sixtyfold recorded it)');
  else {
    lines.push(`submitted with engine ${p.recorded.engineVersion}, commit ${p.recorded.commit}, node ${p.recorded.node}`);
    lines.push(`spec sha256: ${p.recorded.specSha256} (of the stored spec's canonical JSON)`);
    lines.push(`engine options: ${JSON.stringify(p.recorded.engineOptions)}`);
  }
  if (!p.runsRecorded) lines.push('computed by: not recorded');
  for (const w of p.workers) {
    lines.push(`computed by ${w.worker}: engine ${w.engineVersion}, commit ${w.commit}, node ${w.node}; ${w.runs} chunk run(s), ${w.points} point(s), ${w.firstStartedAt} to ${w.lastFinishedAt}`);
  }
  return lines;
}
