import { fileURLToPath } from 'node:url';
import { join } from 'node:path';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
export const DATA_DIR = join(ROOT, '.data');
export const PG_DIR = join(DATA_DIR, 'pg');
export const PG_LOG = join(DATA_DIR, 'postgres.log');
export const LOCAL_CONFIG = join(DATA_DIR, 'local.json');
export const bin = (name) => join(ROOT, 'node_modules', '.bin', name);

export const DATABASES = { dev: 'benchwright', test: 'benchwright_test' };
