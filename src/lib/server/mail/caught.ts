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
	/** The links of the message with their text, so they can be followed from the page. */
	links: { text: string; href: string }[];
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
		newest.map(async (name) => {
			const mail = JSON.parse(await readFile(join(directory, name), 'utf8')) as CaughtMail;
			return { ...mail, links: linksOf(mail.html) };
		})
	);
}

const entities: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" };
const decode = (text: string) =>
	text.replace(/&(amp|lt|gt|quot|#39|#\d+);/g, (_, e: string) =>
		e.startsWith('#') && !(e in entities) ? String.fromCharCode(Number(e.slice(1))) : entities[e]
	);

function linksOf(html: string) {
	const links: { text: string; href: string }[] = [];
	for (const match of html.matchAll(/<a\s[^>]*href="([^"]+)"[^>]*>([\s\S]*?)<\/a>/gi)) {
		const href = decode(match[1]);
		if (/^https?:\/\//.test(href)) {
			links.push({ href, text: decode(match[2].replace(/<[^>]+>/g, '')).trim() });
		}
	}
	return links;
}
