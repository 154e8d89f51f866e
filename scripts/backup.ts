// `npm run backup -- <file or folder>`: an online copy of DATABASE_URL (default data/bulkpad.db), safe while
// the server runs; a folder gets a new bulkpad-<time>.db. See README › Operations › Backup and restore.
import { BackupError, backupDatabase } from '../src/lib/server/db/backup';
import { env } from '../src/lib/server/env';

const dest = process.argv[2];
if (!dest) {
	console.error('usage: npm run backup -- <new file or existing folder>');
	process.exit(2);
}
try {
	const { file, pages } = await backupDatabase(env.databaseUrl, dest);
	console.log(`backed up ${env.databaseUrl} to ${file} (${pages} pages, integrity_check ok)`);
} catch (e) {
	if (!(e instanceof BackupError)) throw e;
	console.error(`backup failed: ${e.message}`);
	process.exit(1);
}
