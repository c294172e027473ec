import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

/** The pid holding the embedded database's lock in `dataDir`, or null when free or stale. */
export function readLockHolder(dataDir) {
	const lockPath = join(dataDir, 'pglite.lock');
	if (!existsSync(lockPath)) return null;
	const pid = Number.parseInt(readFileSync(lockPath, 'utf8').trim(), 10);
	if (!Number.isInteger(pid)) return null;
	try {
		process.kill(pid, 0);
		return pid;
	} catch (err) {
		return err.code === 'EPERM' ? pid : null;
	}
}
