import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;
/** A transaction handle; queries that run inside or outside one take `DbOrTx`. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type DbOrTx = Db | Tx;

export interface Database {
  pool: pg.Pool;
  db: Db;
  close(): Promise<void>;
}

/**
 * Opens a connection pool. Connection errors are logged, never fatal (PostgreSQL may restart):
 * the pool handles idle clients; a checked-out client between two queries of a transaction has
 * no listener of the pool's, and pg would raise its 'error' as an uncaught exception that ends the
 * process. Its next query fails, and the pool discards it on release.
 */
export function openDatabase(url: string, max = 10): Database {
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: 5000 });
  pool.on('error', (err) => console.error(`database: idle client error: ${err.message}`));
  pool.on('connect', (client) => {
    client.on('error', (err) => console.error(`database: connection lost: ${err.message}`));
  });
  return { pool, db: drizzle(pool, { schema }), close: () => pool.end() };
}
