/** Anything that runs SQL: a DataSource, an EntityManager inside a transaction. */
interface Queryable {
  query(sql: string, parameters?: unknown[]): Promise<unknown>;
}

/**
 * The one rule for finishing a scan: it finishes exactly when its last point is stored, as
 * `completed`, or as `failed` when not one point gave a spectrum (every point is then a failure
 * record: too few e-folds, no end of inflation...). Used by the worker after each chunk and by
 * the API's reconciliation.
 */
export async function completeIfAllStored(db: Queryable, scanId: number): Promise<void> {
  await db.query(
    `UPDATE scans SET status = IF(done_points = 0 AND failed_points > 0, 'failed', 'completed'), finished_at = CURRENT_TIMESTAMP(3)
      WHERE id = ? AND status IN ('queued', 'running') AND done_points + failed_points >= total_points`,
    [scanId],
  );
}
