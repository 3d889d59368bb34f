// Migrates the template database once per test run, before the workers start.
import { ensureTemplate } from './test-db';

ensureTemplate()
  .then(() => console.log('test template database is migrated'))
  .catch((err) => {
    console.error('could not prepare the test template database:', err);
    process.exit(1);
  });
