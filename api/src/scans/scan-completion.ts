/** Anything that runs SQL: a DataSource, an EntityManager inside a transaction. */
interface Queryable {
  query(sql: string, parameters?: unknown[]): Promise<unknown>;
}

/**
 * The one rule for finishing a scan: it is completed exactly when its last point is stored.
 * Used by the worker after each chunk and by the API's reconciliation.
 */
export async function completeIfAllStored(db: Queryable, scanId: number): Promise<void> {
  await db.query(
    `UPDATE scans SET status = 'completed', finished_at = CURRENT_TIMESTAMP(3)
      WHERE id = ? AND status IN ('queued', 'running') AND done_points + failed_points >= total_points`,
    [scanId],
  );
}
