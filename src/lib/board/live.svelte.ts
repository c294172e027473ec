/*
 * A revision's live changes in the browser: one EventSource on `…/revisions/{letter}/events`
 * (PRODUCT.md §6). It starts after the sequence number the page was loaded at; when the
 * connection drops the browser reconnects with `Last-Event-ID` and the server sends what was
 * missed from the database. Handlers are registered per type (`feature`, `fit`, `finding`,
 * `comment`, `revision`, or `*`) and usually refetch the changed item.
 */

export type ChangeType = 'feature' | 'fit' | 'finding' | 'comment' | 'revision';

/** One `event: change` as sent: `seq` is its `id:`. */
export interface ChangeEvent {
	seq: number;
	type: ChangeType;
	action: string;
	id: string;
	version: number | null;
	/** A comment's thread. */
	subject?: { type: 'finding' | 'feature'; id: string };
}

/** `live` while connected; `ended` when the server said this person may no longer follow it. */
export type LiveStatus = 'connecting' | 'live' | 'reconnecting' | 'ended';

type Handler = (event: ChangeEvent) => void;

export class LiveRevision {
	status = $state<LiveStatus>('connecting');
	/** The last sequence number received. */
	last: number;
	#source: EventSource | null = null;
	#handlers: Partial<Record<ChangeType | '*', Handler[]>> = {};
	#retry: ReturnType<typeof setTimeout> | undefined;
	#stopped = false;

	constructor(
		/** `…/revisions/{letter}/events`. */
		readonly url: string,
		after: number
	) {
		this.last = after;
	}

	/** Calls `handler` for each change of `type`; returns the way to stop. */
	on(type: ChangeType | '*', handler: Handler) {
		this.#handlers[type] = [...(this.#handlers[type] ?? []), handler];
		return () => {
			this.#handlers[type] = this.#handlers[type]?.filter((h) => h !== handler);
		};
	}

	start() {
		this.#stopped = false;
		addEventListener('online', this.#online);
		addEventListener('offline', this.#offline);
		this.#open();
		return this;
	}

	stop() {
		this.#stopped = true;
		clearTimeout(this.#retry);
		removeEventListener('online', this.#online);
		removeEventListener('offline', this.#offline);
		this.#source?.close();
		this.#source = null;
	}

	// A cut connection can stay open for minutes before anything notices: once the browser
	// knows it is offline, drop the stream, and pick it up from the last event when it is back.
	#offline = () => {
		if (this.status === 'ended') return;
		clearTimeout(this.#retry);
		this.#source?.close();
		this.#source = null;
		this.status = 'reconnecting';
	};

	#online = () => {
		if (this.#source?.readyState !== EventSource.OPEN && this.status !== 'ended') this.#open();
	};

	#open() {
		clearTimeout(this.#retry);
		this.#source?.close();
		if (this.#stopped) return;
		const source = new EventSource(`${this.url}?after=${this.last}`);
		this.#source = source;
		source.onopen = () => (this.status = 'live');
		source.addEventListener('change', (message) => this.#change(message));
		source.addEventListener('end', () => {
			source.close();
			this.status = 'ended';
		});
		source.onerror = () => {
			if (this.status === 'ended' || this.#stopped) return;
			this.status = 'reconnecting';
			// The browser retries by itself while the stream is CONNECTING; once it gave up
			// (an error answer, or offline), try again from the last event received.
			if (source.readyState === EventSource.CLOSED) {
				this.#retry = setTimeout(() => this.#open(), 3000);
			}
		};
	}

	#change(message: MessageEvent<string>) {
		let event: ChangeEvent;
		try {
			event = { ...JSON.parse(message.data), seq: Number(message.lastEventId) };
		} catch {
			return;
		}
		if (event.seq <= this.last) return;
		this.last = event.seq;
		for (const handler of this.#handlers[event.type] ?? []) handler(event);
		for (const handler of this.#handlers['*'] ?? []) handler(event);
	}
}
