import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { Pool } from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema> & { $client: Pool };

/** One pool per database URL; tests create one per test database. */
export function createDb(url: string, { max = 10 }: { max?: number } = {}): Db {
  const pool = new Pool({ connectionString: url, max });
  return drizzle(pool, { schema }) as Db;
}

export { schema };
