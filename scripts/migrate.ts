// Applies drizzle/ migrations to DATABASE_URL (default data/bulkpad.db).
import { openDb } from '../src/lib/server/db/index';
import { env } from '../src/lib/server/env';

openDb();
console.log(`migrated ${env.databaseUrl}`);
