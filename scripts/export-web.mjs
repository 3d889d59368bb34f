// `npm run export:web [-- --force]`: build the web app into dist/ (skipped when unchanged).
import { ensureDeps, exportWeb } from './lib.mjs';

ensureDeps();
exportWeb({ force: process.argv.includes('--force') });
