import { json, text, type Handle, type RequestEvent } from '@sveltejs/kit';
import { config } from './config';

/** The only routes that take a large body: drawing uploads, up to `MAX_UPLOAD_MB`. */
const uploadRoutes = new Set(['POST /api/v1/teams/[team]/drawings/[number]/revisions']);

const isUpload = (event: RequestEvent) =>
	uploadRoutes.has(`${event.request.method} ${event.route.id}`);

function tooLarge(event: RequestEvent, limit: number, close: boolean) {
	const message = `The request body is larger than the ${Math.round(limit / 1024)} KB limit.`;
	// Past the cap the rest is not read: this connection carries no further request.
	const init = { status: 413, headers: close ? { connection: 'close' } : undefined };
	return event.url.pathname.startsWith('/api/') ||
		event.request.headers.get('accept')?.includes('application/json')
		? json({ error: { code: 'too_large', message } }, init)
		: text(message, init);
}

/**
 * Reads and drops what a refused client still sends, so that it reads the 413 rather than a
 * broken connection; past `cap` bytes it stops reading. Returns whether the body ended.
 */
async function drain(reader: ReadableStreamDefaultReader<Uint8Array>, cap: number) {
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) return true;
			size += value.byteLength;
			if (size > cap) {
				await reader.cancel();
				return false;
			}
		}
	} catch {
		return false; // the client went away
	}
}

const drainCap = (limit: number) => 16 * limit;

/**
 * Every request body but an upload's is small (`BODY_LIMIT_KB`, 1 MB by default): a declared
 * length over it is refused before a byte is read, and a body of unknown length (chunked) is
 * read up to the limit and refused once it passes it (the rest is dropped, up to a cap).
 * adapter-node's own `BODY_SIZE_LIMIT` (set by `npm start` from `MAX_UPLOAD_MB`) bounds uploads.
 */
export const bodyLimit: Handle = async ({ event, resolve }) => {
	const { request } = event;
	if (!request.body || isUpload(event)) return resolve(event);
	const limit = config.maxBodyBytes;
	const length = request.headers.get('content-length');
	if (length !== null) {
		// adapter-node refuses a body longer than its declared length. A longer declared length
		// is refused unread; Node drops the body after the answer unless it is past the cap.
		if (Number(length) <= limit) return resolve(event);
		return tooLarge(event, limit, Number(length) > drainCap(limit));
	}
	const reader = request.body.getReader();
	const chunks: Uint8Array[] = [];
	let size = 0;
	for (;;) {
		const { done, value } = await reader.read();
		if (done) break;
		size += value.byteLength;
		if (size > limit) return tooLarge(event, limit, !(await drain(reader, drainCap(limit))));
		chunks.push(value);
	}
	event.request = new Request(request.url, {
		method: request.method,
		headers: request.headers,
		body: Buffer.concat(chunks),
		signal: request.signal
	});
	return resolve(event);
};
