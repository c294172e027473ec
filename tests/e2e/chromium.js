import { existsSync } from 'node:fs';

/** Debian's Chromium (apt-get install chromium), or CHROMIUM_PATH; null when there is none. */
export function findChromium() {
	const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'];
	return candidates.find((path) => path && existsSync(path)) ?? null;
}
