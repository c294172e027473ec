/*
 * Live boards (PRODUCT.md §6, `…/revisions/{letter}/events`): a server-sent-events stream per
 * open board. Every change is a row of the revision's change feed (`revision-events.ts`) and a
 * notification that the database delivers at commit to each instance's one listener (PGlite in
 * this process; on PostgreSQL every instance LISTENs, so a change made through another instance
 * arrives too). This hub hands each event to the streams open on its revision.
 *
 * A stream starts after the sequence number the client names (`Last-Event-ID`, or `?after=`),
 * reading what it missed from the database before it goes live; it sends a heartbeat comment
 * every 15 s, checks the member's access when it opens, at each heartbeat, when the member's
 * role changes or they are removed and when the revision changes state, and ends (`event: end`)
 * once they may no longer see the revision. On shutdown every stream ends with a `retry:` hint.
 */
import type { Database, Db } from './db/connect';
import { can } from './capabilities';
import { getRevisionById, isVisibleToSuppliers } from './db/queries/drawings';
import {
	eventsAfter,
	liveChannel,
	type LiveNotice,
	type RevisionEvent
} from './db/queries/revision-events';
import { getMembership } from './db/queries/teams';

/** Who watches which revision. */
export interface Watcher {
	userId: string;
	teamId: string;
	revisionId: string;
}

export interface LiveOptions {
	/** Between heartbeat comments (and access checks): 15 s. */
	heartbeatMs?: number;
	/** What a stream's client is told to wait before reconnecting after a shutdown: 2 s. */
	retryMs?: number;
	/** Bytes a slow client may leave unread before its stream ends (it catches up on reconnect). */
	maxQueuedBytes?: number;
}

const encoder = new TextEncoder();
const heartbeatFrame = encoder.encode(': heartbeat\n\n');

/** An SSE `change` frame: the sequence number as its `id:`, `{type, action, id, version}` as data. */
export function changeFrame(event: RevisionEvent) {
	const data = {
		type: event.type,
		action: event.action,
		id: event.id,
		version: event.version,
		...(event.subject ? { subject: event.subject } : {})
	};
	return `event: change\nid: ${event.seq}\ndata: ${JSON.stringify(data)}\n\n`;
}

/** May `watcher` still see the revision? A member with `view`; supplier quality: released only. */
export async function mayWatch(db: Db, watcher: Watcher) {
	const membership = await getMembership(db, watcher.teamId, watcher.userId);
	if (!membership || !can(membership.role, 'view')) return false;
	if (can(membership.role, 'viewUnreleased')) return true;
	const revision = await getRevisionById(db, watcher.revisionId);
	return revision !== null && isVisibleToSuppliers(revision.state);
}

class Stream {
	#controller: ReadableStreamDefaultController<Uint8Array>;
	/** The last sequence number sent; live events at or below it are already out. */
	#sent: number;
	/** Live events that came while catching up. */
	#held: RevisionEvent[] | null = [];
	closed = false;

	constructor(
		readonly hub: LiveHub,
		readonly watcher: Watcher,
		controller: ReadableStreamDefaultController<Uint8Array>,
		after: number
	) {
		this.#controller = controller;
		this.#sent = after;
	}

	#write(chunk: string | Uint8Array) {
		if (this.closed) return;
		this.#controller.enqueue(typeof chunk === 'string' ? encoder.encode(chunk) : chunk);
		if ((this.#controller.desiredSize ?? 0) < -this.hub.options.maxQueuedBytes) {
			// A client that reads nothing must not hold our memory: it reconnects and catches up.
			this.end(`retry: ${this.hub.options.retryMs}\n\n`);
		}
	}

	/** `frame`: the event's frame, encoded once for every stream it goes to. */
	#send(event: RevisionEvent, frame?: Uint8Array) {
		if (event.seq <= this.#sent) return;
		this.#sent = event.seq;
		this.#write(frame ?? changeFrame(event));
	}

	async start() {
		this.#write(': live\n\n');
		try {
			for (;;) {
				const missed = await eventsAfter(this.hub.db, this.watcher.revisionId, this.#sent, 500);
				for (const event of missed) this.#send(event);
				if (missed.length < 500 || this.closed) break;
			}
		} catch (err) {
			console.error('A live stream could not catch up', err);
			this.end(`retry: ${this.hub.options.retryMs}\n\n`);
			return;
		}
		const held = this.#held ?? [];
		this.#held = null;
		for (const event of held) this.#send(event);
	}

	deliver(event: RevisionEvent, frame: Uint8Array) {
		if (this.#held) this.#held.push(event);
		else this.#send(event, frame);
	}

	heartbeat() {
		this.#write(heartbeatFrame);
	}

	/** Sends `last` (if any) and closes. */
	end(last?: string) {
		if (this.closed) return;
		this.stop();
		try {
			if (last) this.#controller.enqueue(encoder.encode(last));
			this.#controller.close();
		} catch {
			// already cancelled by the client
		}
	}

	/** Forgets the stream (the client went away, or it ended). */
	stop() {
		this.closed = true;
		this.hub.forget(this);
	}
}

/** One per app instance (and per database): the streams open on it, fed by one listener. */
export class LiveHub {
	readonly options: Required<LiveOptions>;
	#streams = new Map<string, Set<Stream>>();
	#unlisten: (() => Promise<void>) | null = null;
	#heartbeat: ReturnType<typeof setInterval> | undefined;
	#closing = false;

	constructor(
		readonly database: Database,
		options: LiveOptions = {}
	) {
		this.options = {
			heartbeatMs: options.heartbeatMs ?? 15_000,
			retryMs: options.retryMs ?? 2_000,
			maxQueuedBytes: options.maxQueuedBytes ?? 1024 * 1024
		};
	}

	get db() {
		return this.database.db;
	}

	/** How many streams are open (all revisions). */
	get size() {
		let n = 0;
		for (const set of this.#streams.values()) n += set.size;
		return n;
	}

	async start() {
		this.#unlisten ??= await this.database.listen(liveChannel, {
			notice: (payload) => this.#hear(payload),
			// Notifications sent while the listener was away are lost: every stream catches up.
			resumed: () => {
				for (const stream of this.#all()) stream.end(`retry: ${this.options.retryMs}\n\n`);
			}
		});
		// One heartbeat for every stream, and one access check per member and revision watched.
		this.#heartbeat ??= setInterval(() => {
			const all = this.#all();
			for (const stream of all) stream.heartbeat();
			void this.#recheck(all);
		}, this.options.heartbeatMs);
		this.#heartbeat.unref?.();
		return this;
	}

	#all() {
		return [...this.#streams.values()].flatMap((set) => [...set]);
	}

	/** Ends the streams whose member may no longer see their revision (asked once per watcher). */
	async #recheck(streams: Stream[]) {
		const byWatcher = new Map<string, Stream[]>();
		for (const s of streams) {
			if (s.closed) continue;
			const key = `${s.watcher.teamId} ${s.watcher.userId} ${s.watcher.revisionId}`;
			byWatcher.set(key, [...(byWatcher.get(key) ?? []), s]);
		}
		await Promise.all(
			[...byWatcher.values()].map(async (group) => {
				try {
					if (await mayWatch(this.db, group[0].watcher)) return;
				} catch {
					// The database is unreachable for a moment: the next heartbeat asks again.
					return;
				}
				for (const stream of group) stream.end('event: end\ndata: {"reason":"access"}\n\n');
			})
		);
	}

	#hear(payload: string) {
		let notice: LiveNotice;
		try {
			notice = JSON.parse(payload) as LiveNotice;
		} catch {
			return;
		}
		if (notice.kind === 'event') {
			const streams = [...(this.#streams.get(notice.revisionId) ?? [])];
			const frame = encoder.encode(changeFrame(notice));
			for (const stream of streams) stream.deliver(notice, frame);
			// A revision's state decides whether supplier quality may still see it.
			if (notice.type === 'revision') void this.#recheck(streams);
		} else if (notice.kind === 'member') {
			const w = notice;
			void this.#recheck(
				this.#all().filter((s) => s.watcher.teamId === w.teamId && s.watcher.userId === w.userId)
			);
		}
	}

	/**
	 * The SSE answer for `watcher` (whose access the route has checked), starting after sequence
	 * number `after`.
	 */
	open(watcher: Watcher, after: number): Response {
		let stream: Stream | undefined;
		const body = new ReadableStream<Uint8Array>(
			{
				start: (controller) => {
					stream = new Stream(this, watcher, controller, after);
					if (this.#closing) {
						stream.end(`retry: ${this.options.retryMs}\n\n`);
						return;
					}
					let set = this.#streams.get(watcher.revisionId);
					if (!set) this.#streams.set(watcher.revisionId, (set = new Set()));
					set.add(stream);
					void stream.start();
					// Access was checked by the route; a stream opened on a revision it cannot see
					// (a direct caller) ends at the next heartbeat.
				},
				cancel: () => stream?.stop()
			},
			{ highWaterMark: 64 * 1024, size: (chunk) => chunk.byteLength }
		);
		return new Response(body, {
			headers: {
				'content-type': 'text/event-stream; charset=utf-8',
				'cache-control': 'no-store',
				connection: 'keep-alive',
				// A proxy must pass each event on at once.
				'x-accel-buffering': 'no'
			}
		});
	}

	forget(stream: Stream) {
		const set = this.#streams.get(stream.watcher.revisionId);
		set?.delete(stream);
		if (set?.size === 0) this.#streams.delete(stream.watcher.revisionId);
	}

	/** Ends every stream with a `retry:` hint (the clients come back, to this or another instance). */
	endAll() {
		this.#closing = true;
		clearInterval(this.#heartbeat);
		for (const stream of this.#all()) stream.end(`retry: ${this.options.retryMs}\n\n`);
	}

	async stop() {
		this.endAll();
		const unlisten = this.#unlisten;
		this.#unlisten = null;
		await unlisten?.();
	}
}

let hub: LiveHub | null = null;

/** The app's hub (started by `init` in hooks.server.ts). */
export function liveHub() {
	if (!hub) throw new Error('Live events not started: init in hooks.server.ts has not run');
	return hub;
}

/** Starts the app's hub once, and ends its streams when the server shuts down. */
export async function startLive(database: Database) {
	if (hub) return hub;
	hub = await new LiveHub(database).start();
	const started = hub;
	// adapter-node closes the server on these signals and waits for open answers to finish:
	// streams never finish by themselves, so end them at once.
	const end = () => started.endAll();
	process.once('SIGTERM', end);
	process.once('SIGINT', end);
	process.once('sveltekit:shutdown', () => void started.stop());
	return hub;
}
