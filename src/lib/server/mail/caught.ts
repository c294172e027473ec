import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';

export interface CaughtMail {
	id: string;
	receivedAt: string;
	messageId: string | null;
	from: string;
	to: string[];
	subject: string;
	text: string;
	html: string;
}

/** Reads what the SMTP fake caught, newest first. */
export async function listCaughtMail(directory: string, limit = 200): Promise<CaughtMail[]> {
	let names: string[];
	try {
		names = await readdir(directory);
	} catch {
		return [];
	}
	const newest = names
		.filter((n) => n.endsWith('.json'))
		.sort()
		.reverse()
		.slice(0, limit);
	return Promise.all(
		newest.map(
			async (name) => JSON.parse(await readFile(join(directory, name), 'utf8')) as CaughtMail
		)
	);
}
