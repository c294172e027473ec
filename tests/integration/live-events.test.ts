import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import type { DrawingRow, RevisionRow, Role } from '../../src/lib/server/db/schema';
import {
	createDrawing,
	insertRevision,
	updateRevision
} from '../../src/lib/server/db/queries/drawings';
import { addMember, createTeam, removeMember } from '../../src/lib/server/db/queries/teams';
import { createUser } from '../../src/lib/server/db/queries/users';
import { eventsAfter, latestEventSeq } from '../../src/lib/server/db/queries/revision-events';
import { getFeature } from '../../src/lib/server/db/queries/features';
import { getFinding } from '../../src/lib/server/db/queries/findings';
import { addFeature, editFeature, removeFeature } from '../../src/lib/server/features';
import { raiseFinding } from '../../src/lib/server/findings';
import { addComment, findingThread } from '../../src/lib/server/comments';
import { LiveHub, type Watcher } from '../../src/lib/server/live-events';
import { featureInput } from '../../src/lib/schemas/features';
import { findingInput } from '../../src/lib/schemas/findings';
import { freshDatabase, freshPostgres, testDatabase } from './harness';

type User = { id: string; name: string | null; email: string };

let database: Database;
let hub: LiveHub;
const people = {} as Record<Role, User>;
let team: Awaited<ReturnType<typeof createTeam>>;
let drawing: DrawingRow;
let letters = 0;

async function newRevision(db = database.db) {
	const letter = 'ABCDEFGHJKLMNPRTUVWY'[letters++];
	const sheet = { width: 1190.55, height: 841.89 };
	const revision = await insertRevision(db, people.drafter, drawing, {
		letter,
		pages: 1,
		sheets: [sheet],
		sha256: letter.repeat(64),
		size: 1000,
		storageKey: `test/${letter}.pdf`
	});
	return { team, drawing, revision };
}

/** A stream's frames as they arrive: `next` waits for one (or the end, as null). */
function reader(response: Response) {
	const body = response.body!.getReader();
	const decoder = new TextDecoder();
	let buffer = '';
	const frames: string[] = [];
	let ended = false;
	let wake = null as (() => void) | null;
	void (async () => {
		for (;;) {
			const { done, value } = await body.read().catch(() => ({ done: true, value: undefined }));
			if (done) break;
			buffer += decoder.decode(value, { stream: true });
			let cut: number;
			while ((cut = buffer.indexOf('\n\n')) >= 0) {
				frames.push(buffer.slice(0, cut));
				buffer = buffer.slice(cut + 2);
			}
			wake?.();
		}
		ended = true;
		wake?.();
	})();
	return {
		/** The next frame that is no comment, or null once the stream ended. */
		async next(timeoutMs = 5000): Promise<string | null> {
			const deadline = Date.now() + timeoutMs;
			for (;;) {
				while (frames.length > 0) {
					const frame = frames.shift()!;
					if (!frame.startsWith(':')) return frame;
				}
				if (ended) return null;
				if (Date.now() > deadline) throw new Error('no frame in time');
				await new Promise<void>((done) => {
					wake = done;
					setTimeout(done, 50);
				});
			}
		},
		cancel: () => body.cancel()
	};
}

/** A `change` frame's id and data. */
function change(frame: string | null) {
	expect(frame).toMatch(/^event: change\n/);
	const seq = Number(/^id: (\d+)$/m.exec(frame!)![1]);
	const data = JSON.parse(/^data: (.*)$/m.exec(frame!)![1]);
	return { seq, ...data };
}

const watcher = (role: Role, revision: RevisionRow): Watcher => ({
	userId: people[role].id,
	teamId: team.id,
	revisionId: revision.id
});

async function feature(place: Awaited<ReturnType<typeof newRevision>>, callout = 'Ø12 H7') {
	const added = await addFeature(
		database.db,
		people.drafter,
		place,
		featureInput.parse({ kind: 'bore', callout })
	);
	if (!added.ok) throw new Error(added.message);
	return added.feature;
}

beforeAll(async () => {
	database = await freshDatabase();
	hub = await new LiveHub(database, { heartbeatMs: 200 }).start();
	const user = async (name: string, email: string) =>
		(await createUser(database.db, { name, email, passwordHash: null }))!;
	people.admin = await user('Ada Admin', 'ada@example.test');
	people.drafter = await user('Tomas Reyes', 'drafter@example.test');
	people.checker = await user('Priya Natarajan', 'checker@example.test');
	people.quality = await user('Ken Halloran', 'quality@example.test');
	team = await createTeam(database.db, people.admin, { slug: 'acme', name: 'Acme' });
	for (const role of ['drafter', 'checker', 'quality'] as const) {
		await addMember(database.db, people.admin, team.id, people[role], role);
	}
	drawing = await createDrawing(database.db, people.drafter, team.id, {
		number: 'P-300',
		title: 'Cover',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm' }
	});
});
afterAll(async () => {
	await hub?.stop();
	await database?.close();
});

describe("a revision's change feed", () => {
	it('records every kind of change in the write, numbered in commit order', async () => {
		const place = await newRevision();
		const start = await latestEventSeq(database.db, place.revision.id);
		expect(start).toBe(0);
		const bore = await feature(place);
		const edited = await editFeature(database.db, people.drafter, place, bore as never, {
			version: bore.version,
			label: 'Bore'
		});
		expect(edited.ok).toBe(true);
		const raised = await raiseFinding(
			database.db,
			people.checker,
			place,
			findingInput.parse({ text: 'Chamfer?', severity: 'minor' })
		);
		if (!raised.ok) throw new Error(raised.message);
		const finding = (await getFinding(database.db, place.revision.id, raised.finding.id))!;
		const commented = await addComment(
			database.db,
			{ user: people.drafter, role: 'drafter' },
			findingThread(place, finding),
			'The chamfer is on sheet 1.'
		);
		if (!commented.ok) throw new Error(commented.message);
		const settled = await updateRevision(
			database.db,
			people.drafter,
			drawing,
			place.revision,
			place.revision.version,
			{ reason: 'Tolerances added' }
		);
		expect(settled.ok).toBe(true);
		const row = (await getFeature(database.db, place.revision.id, bore.id))!;
		const removed = await removeFeature(database.db, people.drafter, place, row, row.version);
		expect(removed.ok).toBe(true);

		const events = await eventsAfter(database.db, place.revision.id, 0);
		expect(events.map((e) => `${e.type} ${e.action} ${e.version}`)).toEqual([
			'feature create 1',
			'feature update 2',
			'finding create 1',
			'comment create null',
			'revision update 2',
			'feature delete 2'
		]);
		const seqs = events.map((e) => e.seq);
		expect([...seqs].sort((a, b) => a - b)).toEqual(seqs);
		expect(events[0].id).toBe(bore.id);
		expect(events[3].subject).toEqual({ type: 'finding', id: finding.id });
	});
});

describe('the events stream', () => {
	it('catches up from a Last-Event-ID out of the database, then goes live', async () => {
		const place = await newRevision();
		const first = await feature(place, 'Ø6 H7');
		const second = await feature(place, 'Ø8 H7');
		const [seen] = await eventsAfter(database.db, place.revision.id, 0);
		expect(seen.id).toBe(first.id);

		// A client that saw only the first event reconnects: it gets the second from the rows.
		const stream = reader(hub.open(watcher('drafter', place.revision), seen.seq));
		const missed = change(await stream.next());
		expect(missed).toMatchObject({ type: 'feature', action: 'create', id: second.id, version: 1 });
		expect(missed.seq).toBeGreaterThan(seen.seq);

		const third = await feature(place, 'Ø10 H7');
		const live = change(await stream.next());
		expect(live).toMatchObject({ type: 'feature', action: 'create', id: third.id });
		expect(live.seq).toBeGreaterThan(missed.seq);
		// Events of another revision never reach it.
		await feature(await newRevision(), 'Ø4 H7');
		const fourth = await feature(place, 'Ø14 H7');
		expect(change(await stream.next())).toMatchObject({ id: fourth.id });
		await stream.cancel();
	});

	it('sends heartbeat comments', async () => {
		const place = await newRevision();
		const response = hub.open(watcher('checker', place.revision), 0);
		expect(response.headers.get('content-type')).toContain('text/event-stream');
		const body = response.body!.getReader();
		let text = '';
		const deadline = Date.now() + 3000;
		while (!text.includes(': heartbeat') && Date.now() < deadline) {
			text += new TextDecoder().decode((await body.read()).value);
		}
		expect(text).toContain(': heartbeat\n\n');
		await body.cancel();
	});

	it("ends a removed member's stream at once, and refuses to follow a revision they cannot see", async () => {
		const place = await newRevision();
		const gone = (await createUser(database.db, {
			name: 'Lee Leaving',
			email: 'lee@example.test',
			passwordHash: null
		}))!;
		await addMember(database.db, people.admin, team.id, gone, 'checker');
		const open = hub.size;
		const stream = reader(
			hub.open({ userId: gone.id, teamId: team.id, revisionId: place.revision.id }, 0)
		);
		await feature(place);
		expect(change(await stream.next())).toMatchObject({ type: 'feature' });
		await removeMember(database.db, people.admin, team.id, gone.id);
		expect(await stream.next(2000)).toBe('event: end\ndata: {"reason":"access"}');
		expect(await stream.next(2000)).toBeNull();
		expect(hub.size).toBe(open);
	});

	it('ends a supplier quality stream on a revision that is not released at the next check', async () => {
		const place = await newRevision();
		const stream = reader(hub.open(watcher('quality', place.revision), 0));
		expect(await stream.next(2000)).toBe('event: end\ndata: {"reason":"access"}');
		expect(await stream.next(2000)).toBeNull();
	});

	it('ends every stream with a retry hint when the app shuts down', async () => {
		const other = await new LiveHub(database).start();
		const place = await newRevision();
		const response = other.open(watcher('drafter', place.revision), 0);
		const body = response.body!.getReader();
		await body.read();
		await other.stop();
		let text = '';
		for (;;) {
			const { done, value } = await body.read();
			if (done) break;
			text += new TextDecoder().decode(value);
		}
		expect(text).toBe('retry: 2000\n\n');
	});
});

describe.skipIf(testDatabase !== 'postgres')('two instances on one PostgreSQL database', () => {
	it("deliver each other's events (LISTEN/NOTIFY)", async () => {
		// The second instance: its own pool and listener on the same database.
		const shared = await freshPostgres();
		await shared.migrate();
		const url = shared.url;
		const { openPostgres } = await import('../../src/lib/server/db/connect');
		const one = await openPostgres(url);
		const two = await openPostgres(url);
		const hubOne = await new LiveHub(one).start();
		const hubTwo = await new LiveHub(two).start();
		try {
			const admin = (await createUser(one.db, {
				name: 'Ada',
				email: 'ada2@example.test',
				passwordHash: null
			}))!;
			const acme = await createTeam(one.db, admin, { slug: 'acme2', name: 'Acme 2' });
			const cover = await createDrawing(one.db, admin, acme.id, {
				number: 'P-400',
				title: 'Cover',
				units: 'mm',
				standard: 'iso-8015',
				generalTolerance: null
			});
			const sheet = { width: 595, height: 842 };
			const revision = await insertRevision(one.db, admin, cover, {
				letter: 'A',
				pages: 1,
				sheets: [sheet],
				sha256: 'a'.repeat(64),
				size: 1,
				storageKey: 'x.pdf'
			});
			const place = { team: acme, drawing: cover, revision };
			const w = { userId: admin.id, teamId: acme.id, revisionId: revision.id };
			const onTwo = reader(hubTwo.open(w, 0));
			const onOne = reader(hubOne.open(w, 0));
			const viaOne = await addFeature(
				one.db,
				admin,
				place,
				featureInput.parse({ kind: 'bore', callout: 'Ø5 H7' })
			);
			const viaTwo = await addFeature(
				two.db,
				admin,
				place,
				featureInput.parse({ kind: 'bore', callout: 'Ø7 H7' })
			);
			if (!viaOne.ok || !viaTwo.ok) throw new Error('not added');
			for (const stream of [onOne, onTwo]) {
				expect(change(await stream.next())).toMatchObject({ id: viaOne.feature.id });
				expect(change(await stream.next())).toMatchObject({ id: viaTwo.feature.id });
			}
			await onOne.cancel();
			await onTwo.cancel();
		} finally {
			await hubOne.stop();
			await hubTwo.stop();
			await one.close();
			await two.close();
			await shared.close();
		}
	});
});
