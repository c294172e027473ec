/** Only same-site paths: never an absolute URL or a protocol-relative `//host`. */
export function safeRedirect(target: string | null | undefined, fallback = '/') {
	if (!target || !target.startsWith('/') || target.startsWith('//') || target.startsWith('/\\')) {
		return fallback;
	}
	return target;
}
