/**
 * Only our own origin: the target is resolved against it the way a browser would (which drops
 * tabs and new lines and reads `\` as `/`), and anything landing on another origin falls back.
 */
export function safeRedirect(target: string | null | undefined, origin: string, fallback = '/') {
	if (!target || !target.startsWith('/')) return fallback;
	let url: URL;
	try {
		url = new URL(target, origin);
	} catch {
		return fallback;
	}
	if (url.origin !== new URL(origin).origin) return fallback;
	return url.pathname + url.search + url.hash;
}
