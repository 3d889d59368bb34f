/**
 * A fresh PostgreSQL database per test file, cloned from a template migrated once per run.
 * The cluster is the project's private test cluster (scripts/pg.mjs, fsync off).
 */
import { execFileSync } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import { createDb, type Db } from '../../db/client';
import { runMigrations } from '../../db/migrate';

const root = path.resolve(__dirname, '../..');
const TEMPLATE = 'frameside_template';

export function adminUrl(): string {
  if (process.env.FRAMESIDE_TEST_DATABASE_URL) return process.env.FRAMESIDE_TEST_DATABASE_URL;
  const url = execFileSync(process.execPath, [path.join(root, 'scripts/pg.mjs'), 'url', '--test'], { encoding: 'utf8' }).trim();
  process.env.FRAMESIDE_TEST_DATABASE_URL = url;
  return url;
}

const withDb = (url: string, name: string) => {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
};

/** A fingerprint of the committed migrations: the template is rebuilt when they change. */
function migrationsFingerprint(): string {
  const dir = path.join(root, 'db/migrations');
  const h = createHash('sha256');
  for (const f of fs.readdirSync(dir).filter((f) => f.endsWith('.sql')).sort()) h.update(f).update(fs.readFileSync(path.join(dir, f)));
  return h.digest('hex').slice(0, 16);
}

/**
 * Creates (or refreshes) the migrated template, and clones it into `cloneAs` when given, all under
 * one advisory lock so that parallel workers never clone a template another is rebuilding.
 */
export async function ensureTemplate(cloneAs?: string): Promise<void> {
  const admin = new Client({ connectionString: adminUrl() });
  await admin.connect();
  try {
    await admin.query('select pg_advisory_lock(424242)');
    const fp = migrationsFingerprint();
    const { rows } = await admin.query(
      `select shobj_description(d.oid, 'pg_database') as fp from pg_database d where datname = $1`,
      [TEMPLATE],
    );
    if (rows[0]?.fp !== fp) {
      if (rows.length) await admin.query(`drop database ${TEMPLATE} with (force)`);
      await admin.query(`create database ${TEMPLATE}`);
      await runMigrations(withDb(adminUrl(), TEMPLATE));
      await admin.query(`comment on database ${TEMPLATE} is '${fp}'`);
    }
    if (cloneAs) await admin.query(`create database ${cloneAs} template ${TEMPLATE}`);
  } finally {
    await admin.query('select pg_advisory_unlock(424242)').catch(() => undefined);
    await admin.end();
  }
}

export interface TestDb {
  url: string;
  db: Db;
  drop(): Promise<void>;
}

export async function createTestDb(): Promise<TestDb> {
  const name = `t_${randomBytes(6).toString('hex')}`;
  await ensureTemplate(name);
  const url = withDb(adminUrl(), name);
  const db = createDb(url, { max: 5 });
  return {
    url,
    db,
    async drop() {
      await db.$client.end();
      const a = new Client({ connectionString: adminUrl() });
      await a.connect();
      await a.query(`drop database if exists ${name} with (force)`);
      await a.end();
    },
  };
}
