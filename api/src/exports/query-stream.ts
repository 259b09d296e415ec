import type { Readable } from 'node:stream';
import type { DataSource } from 'typeorm';

/** What a download reads from, and how it lets go of it when it ends. */
export interface ExportSource {
  readable: Readable;
  /** `completed`: every byte was read. Called once, however the download ended. */
  close(completed: boolean): Promise<void>;
}

/** The mysql2 pool connection under TypeORM's query runner. */
interface StreamingConnection {
  threadId: number;
  query(options: { sql: string; values: unknown[]; rowsAsArray?: boolean }): { stream(): Readable };
  destroy(): void;
}

/**
 * A SELECT whose rows arrive as a stream, on a pooled connection of its own (so the pool's acquire
 * timeout and queue limit apply). Not TypeORM's `stream()`: that returns the connection only when
 * the query ends, and a destroyed mysql2 result stream resumes and reads every remaining row first.
 * A query abandoned mid-way here destroys its connection instead, and the pool opens a fresh one for
 * the next request; the server thread is killed too, because MariaDB notices a closed socket only
 * when it next writes to it (a sort of every matching row may run long before that).
 */
export async function openQueryStream(db: DataSource, sql: string, parameters: unknown[], { rowsAsArray = false } = {}): Promise<ExportSource> {
  const runner = db.createQueryRunner();
  const connection = (await runner.connect()) as StreamingConnection;
  const readable = connection.query({ sql, values: parameters, rowsAsArray }).stream();
  return {
    readable,
    async close(completed) {
      if (!completed) connection.destroy();
      await runner.release();
      // Gone already (it ended by itself) is as good.
      if (!completed) await db.query(`KILL ${Number(connection.threadId)}`).catch(() => undefined);
    },
  };
}
