import { building } from '$app/environment';
import { db } from '../db';
import { getMailer } from '../services';
import { deliverDueMail } from './outbox';

let timer: ReturnType<typeof setInterval> | undefined;
let running = false;

async function tick() {
	if (running) return;
	running = true;
	try {
		await deliverDueMail(db, getMailer());
	} catch (err) {
		console.error('[outbox] delivery round failed:', (err as Error).message);
	} finally {
		running = false;
	}
}

/** Delivers queued mail every few seconds, and at once when something is queued. */
export function startOutboxWorker(intervalMs = 2_000) {
	if (building || timer) return;
	timer = setInterval(() => void tick(), intervalMs);
	timer.unref();
	process.once('sveltekit:shutdown', () => clearInterval(timer));
}

export function nudgeOutbox() {
	if (timer) setTimeout(() => void tick(), 0);
}
