// Plain JavaScript so that `scripts/start.js` (run before any build) and the app share it.

/**
 * Whether a listen address reaches this machine only: 127.0.0.0/8, ::1 or `localhost`.
 * `0.0.0.0`, `::` and every other address answer beyond it.
 * @param {string} host
 */
export function isLoopbackHost(host) {
	const address = host
		.trim()
		.toLowerCase()
		.replace(/^\[|\]$/g, '');
	return (
		address === 'localhost' ||
		address === '::1' ||
		/^127(\.\d{1,3}){3}$/.test(address) ||
		/^::ffff:127(\.\d{1,3}){3}$/.test(address)
	);
}
