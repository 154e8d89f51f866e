// `npm run restore -- <backup file>`: with the server stopped, puts a checked backup in place of DATABASE_URL
// (default data/bulkpad.db) and keeps the replaced file aside. See README › Operations › Backup and restore.
import { BackupError, restoreDatabase } from '../src/lib/server/db/backup';
import { env } from '../src/lib/server/env';

const backup = process.argv[2];
if (!backup) {
	console.error('usage: npm run restore -- <backup file>   (stop the server first)');
	process.exit(2);
}
try {
	const { keptAside } = restoreDatabase(backup, env.databaseUrl);
	console.log(`restored ${backup} to ${env.databaseUrl}${keptAside ? `; the previous database is kept as ${keptAside}` : ''}`);
	console.log('start the server again; it applies any newer migrations on start');
} catch (e) {
	if (!(e instanceof BackupError)) throw e;
	console.error(`restore refused: ${e.message}`);
	process.exit(1);
}
