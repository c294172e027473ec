import { json, text, type Handle, type RequestEvent } from '@sveltejs/kit';
import { config } from './config';

/** The only routes that take a large body: drawing uploads, up to `MAX_UPLOAD_MB`. */
const uploadRoutes = new Set(['POST /api/v1/teams/[team]/drawings/[number]/revisions']);

const isUpload = (event: RequestEvent) =>
	uploadRoutes.has(`${event.request.method} ${event.route.id}`);

/**
 * Answers 413 at once, while the rest of the body is read and dropped behind the answer (up to
 * a cap, then the connection is cut): a client still sending then reads the 413 rather than a
 * stalled or broken connection, and the connection serves its next request.
 */
function tooLarge(event: RequestEvent, limit: number, body: ReadableStream<Uint8Array>) {
	void drain(body.getReader(), drainCap(limit));
	const message = `The request body is larger than the ${Math.round(limit / 1024)} KB limit.`;
	return event.url.pathname.startsWith('/api/') ||
		event.request.headers.get('accept')?.includes('application/json')
		? json({ error: { code: 'too_large', message } }, { status: 413 })
		: text(message, { status: 413 });
}

async function drain(reader: ReadableStreamDefaultReader<Uint8Array>, cap: number) {
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) return;
			size += value.byteLength;
			if (size > cap) return void (await reader.cancel());
		}
	} catch {
		// the client went away
	}
}

const drainCap = (limit: number) => 16 * limit;

/**
 * Every request body but an upload's is small (`BODY_LIMIT_KB`, 1 MB by default): a declared
 * length over it gets 413 at once, and a body of unknown length (chunked) is read up to the
 * limit and refused once it passes it. adapter-node's own `BODY_SIZE_LIMIT` (set by `npm start`
 * from `MAX_UPLOAD_MB`) bounds uploads.
 */
export const bodyLimit: Handle = async ({ event, resolve }) => {
	const { request } = event;
	if (!request.body || isUpload(event)) return resolve(event);
	const limit = config.maxBodyBytes;
	const length = request.headers.get('content-length');
	if (length !== null) {
		// adapter-node refuses a body longer than its declared length.
		return Number(length) <= limit ? resolve(event) : tooLarge(event, limit, request.body);
	}
	const reader = request.body.getReader();
	const chunks: Uint8Array[] = [];
	let size = 0;
	for (;;) {
		const { done, value } = await reader.read();
		if (done) break;
		size += value.byteLength;
		if (size > limit) {
			reader.releaseLock();
			return tooLarge(event, limit, request.body);
		}
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
