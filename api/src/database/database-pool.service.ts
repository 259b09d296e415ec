import { Injectable, type OnModuleInit, ServiceUnavailableException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { DatabaseConfig } from '../config/database.config';

/** A pooled mysql2 connection, as TypeORM's MySQL driver hands it out. */
interface PooledConnection {
  release(): void;
}

/**
 * mysql2's pool keeps its counts in these fields and offers no public way to read them; they are
 * the only source for the pool figures (health), so they are read here and nowhere else.
 */
interface MysqlPool {
  config: { connectionLimit: number };
  _allConnections: { length: number };
  _freeConnections: { length: number };
  _connectionQueue: { length: number };
}

interface MysqlDriver {
  pool?: MysqlPool;
  obtainMasterConnection(): Promise<PooledConnection>;
}

export interface PoolFigures {
  /** Connections the pool may hold. */
  size: number;
  /** Connections lent out now. */
  inUse: number;
  /** Connections that a request could take at once: idle ones plus room to open more. */
  free: number;
  /** Requests waiting for a connection. */
  queued: number;
}

/**
 * The API's view of the database pool: bounds every wait for a connection (mysql2 has a queue
 * limit but no acquire timeout), so that a taken pool answers 503 instead of hanging, and reports
 * the pool's figures.
 */
@Injectable()
export class DatabasePoolService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly config: ConfigService,
  ) {}

  onModuleInit(): void {
    const { acquireTimeoutMs } = this.config.getOrThrow<DatabaseConfig>('database');
    const driver = this.driver;
    const obtain = driver.obtainMasterConnection.bind(driver);
    // Every TypeORM query runner takes its connection here (replica reads too, through this method).
    driver.obtainMasterConnection = () =>
      new Promise<PooledConnection>((resolve, reject) => {
        let late = false;
        const timer = setTimeout(() => {
          late = true;
          reject(this.busy(`no database connection came free within ${acquireTimeoutMs} ms`));
        }, acquireTimeoutMs);
        obtain().then(
          (connection) => {
            clearTimeout(timer);
            // The request has given up meanwhile: pass the connection on to the next in line.
            if (late) connection.release();
            else resolve(connection);
          },
          (err: Error) => {
            clearTimeout(timer);
            reject(err.message === 'Queue limit reached.' ? this.busy('too many requests are already waiting for a database connection') : err);
          },
        );
      });
  }

  figures(): PoolFigures {
    const pool = this.driver.pool;
    if (!pool) return { size: 0, inUse: 0, free: 0, queued: 0 };
    const size = pool.config.connectionLimit;
    const inUse = pool._allConnections.length - pool._freeConnections.length;
    return { size, inUse, free: size - inUse, queued: pool._connectionQueue.length };
  }

  private get driver(): MysqlDriver {
    return this.db.driver as unknown as MysqlDriver;
  }

  private busy(why: string): ServiceUnavailableException {
    const { size, queued } = this.figures();
    return new ServiceUnavailableException(`The database is busy: ${why} (all ${size} in use, ${queued} waiting). Try again in a moment`);
  }
}
