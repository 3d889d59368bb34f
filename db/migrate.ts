import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import { createDb } from './client';

/** Applies every committed migration; throws (and exits non-zero from the CLI) on any failure. */
export async function runMigrations(url: string): Promise<void> {
  const db = createDb(url, { max: 1 });
  try {
    await migrate(db, { migrationsFolder: path.join(__dirname, 'migrations') });
  } finally {
    await db.$client.end();
  }
}

if (require.main === module) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error('migrate: DATABASE_URL is not set');
    process.exit(1);
  }
  runMigrations(url)
    .then(() => console.log('migrate: database is up to date'))
    .catch((err) => {
      console.error('migrate: FAILED —', err instanceof Error ? err.message : err);
      process.exit(1);
    });
}
