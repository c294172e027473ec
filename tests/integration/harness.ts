import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openPglite, type Database } from '../../src/lib/server/db/connect';
import { startS3Fake } from '../../fakes/s3.js';
import { startSmtpFake } from '../../fakes/smtp.js';

export function tempDir(prefix = 'checkplate-test-') {
	const dir = mkdtempSync(join(tmpdir(), prefix));
	return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/** A fresh in-memory database with the real migrations applied. */
export async function freshDatabase(): Promise<Database> {
	const database = await openPglite(null);
	await database.migrate();
	return database;
}

export async function startFakes() {
	const temp = tempDir('checkplate-fakes-');
	const bucket = 'checkplate-test';
	const s3 = await startS3Fake({ port: 0, directory: join(temp.dir, 's3'), bucket });
	const mailDir = join(temp.dir, 'mail');
	const smtp = await startSmtpFake({ port: 0, directory: mailDir });
	return {
		storageSettings: {
			endpoint: s3.endpoint,
			bucket,
			region: 'us-east-1',
			accessKeyId: 'S3RVER',
			secretAccessKey: 'S3RVER'
		},
		smtpUrl: smtp.url,
		mailDir,
		async stop() {
			await Promise.allSettled([s3.close(), smtp.close()]);
			temp.remove();
		}
	};
}
