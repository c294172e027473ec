import { and, desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import {
	activity,
	comments,
	drawings,
	findings,
	revisions,
	type DrawingRow,
	type FindingRow,
	type Role
} from '../../src/lib/server/db/schema';
import { createDrawing, insertRevision } from '../../src/lib/server/db/queries/drawings';
import { addMember, createTeam } from '../../src/lib/server/db/queries/teams';
import { createUser } from '../../src/lib/server/db/queries/users';
import { getFinding, openFindingsByFeature } from '../../src/lib/server/db/queries/findings';
import { getComment } from '../../src/lib/server/db/queries/comments';
import { addFeature } from '../../src/lib/server/features';
import {
	changeFinding,
	findingsOf,
	raiseFinding,
	type FindingPlace
} from '../../src/lib/server/findings';
import {
	addComment,
	commentsOf,
	editComment,
	featureThread,
	findingThread
} from '../../src/lib/server/comments';
import { featureInput } from '../../src/lib/schemas/features';
import { findingInput, findingPatch, findingQuery } from '../../src/lib/schemas/findings';
import { findingStates, type FindingState } from '../../src/lib/findings';
import { freshDatabase } from './harness';

type User = { id: string; name: string | null; email: string };

let database: Database;
const people = {} as Record<Role, User>;
let stranger: User;
let team: Awaited<ReturnType<typeof createTeam>>;
let drawing: DrawingRow;
let nextLetter = 0;

const sheet = { width: 1190.55, height: 841.89 };

async function newRevision(): Promise<FindingPlace> {
	const n = nextLetter++;
	const letter = (n >= 20 ? 'A' : '') + 'ABCDEFGHJKLMNPRTUVWY'[n % 20];
	const revision = await insertRevision(database.db, people.drafter, drawing, {
		letter,
		pages: 2,
		sheets: [sheet, sheet],
		sha256: letter.repeat(64).slice(0, 64),
		size: 1000,
		storageKey: `test/${letter}.pdf`
	});
	return { team, drawing, revision };
}

async function user(name: string, email: string) {
	return (await createUser(database.db, { name, email, passwordHash: null }))!;
}

const input = (data: Record<string, unknown>) => findingInput.parse(data);
const patch = (data: Record<string, unknown>) => findingPatch.parse(data);
const asker = (role: Role) => ({ user: people[role], role });

async function raise(place: FindingPlace, data: Record<string, unknown> = {}) {
	const raised = await raiseFinding(
		database.db,
		people.checker,
		place,
		input({ text: 'Give the slot a tolerance', severity: 'major', ...data })
	);
	if (!raised.ok) throw new Error(raised.message);
	return (await getFinding(database.db, place.revision.id, raised.finding.id))!;
}

beforeAll(async () => {
	database = await freshDatabase();
	people.admin = await user('Ada Admin', 'ada@example.test');
	people.drafter = await user('Tomas Reyes', 'drafter@example.test');
	people.checker = await user('Priya Natarajan', 'checker@example.test');
	people.quality = await user('Ken Halloran', 'quality@example.test');
	stranger = await user('Sam Elsewhere', 'sam@example.test');
	team = await createTeam(database.db, people.admin, { slug: 'acme', name: 'Acme' });
	for (const role of ['drafter', 'checker', 'quality'] as const) {
		await addMember(database.db, people.admin, team.id, people[role], role);
	}
	// Sam has a team of his own, and is no member of ours.
	await createTeam(database.db, stranger, { slug: 'elsewhere', name: 'Elsewhere' });
	drawing = await createDrawing(database.db, people.drafter, team.id, {
		number: 'P-200',
		title: 'Housing',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm' }
	});
});
afterAll(() => database?.close());

describe('raising findings', () => {
	it('numbers them per drawing, never reused, and keeps who raised them, when and where', async () => {
		const place = await newRevision();
		const area = { sheet: 2, x: 0.1, y: 0.2, w: 0.3, h: 0.15 };
		const first = await raiseFinding(
			database.db,
			people.checker,
			place,
			input({
				text: 'The title block has no surface finish',
				severity: 'minor',
				assigneeId: people.drafter.id,
				location: area
			})
		);
		expect(first).toMatchObject({
			ok: true,
			finding: {
				kind: 'manual',
				rule: null,
				state: 'raised',
				severity: 'minor',
				assigneeId: people.drafter.id,
				raisedBy: people.checker.id,
				location: area,
				waiver: null,
				carried: null,
				version: 1,
				history: []
			}
		});
		if (!first.ok) return;
		expect(Date.now() - Date.parse(first.finding.createdAt)).toBeLessThan(60_000);
		const second = await raise(place);
		expect(second.number).toBe(first.finding.number + 1);
		// The next revision of the drawing goes on counting.
		const later = await raise(await newRevision());
		expect(later.number).toBe(first.finding.number + 2);
		const trail = await database.db
			.select()
			.from(activity)
			.where(and(eq(activity.entity, 'finding'), eq(activity.entityId, first.finding.id)));
		expect(trail).toHaveLength(1);
		expect(trail[0]).toMatchObject({ action: 'create', actorId: people.checker.id });
		expect(trail[0].after).toMatchObject({ number: first.finding.number, location: area });
	});

	it('ties a finding to a feature of the revision', async () => {
		const place = await newRevision();
		const feature = await addFeature(
			database.db,
			people.drafter,
			{ ...place, team },
			featureInput.parse({ kind: 'hole', callout: 'Ø12 H7' })
		);
		if (!feature.ok) throw new Error(feature.message);
		const raised = await raiseFinding(
			database.db,
			people.checker,
			place,
			input({ text: 'Is this bore a datum?', severity: 'note', featureId: feature.feature.id })
		);
		expect(raised).toMatchObject({ ok: true, finding: { featureId: feature.feature.id } });
		// A feature of another revision is not this revision's.
		const elsewhere = await raiseFinding(
			database.db,
			people.checker,
			await newRevision(),
			input({ text: 'x', severity: 'note', featureId: feature.feature.id })
		);
		expect(elsewhere).toMatchObject({ ok: false, status: 400, field: 'featureId' });
	});

	it('refuse bad input clearly and change nothing', async () => {
		const place = await newRevision();
		expect(findingInput.safeParse({ text: '  ', severity: 'major' }).error?.issues[0].message).toBe(
			'Say what is wrong'
		);
		expect(findingInput.safeParse({ text: 'x', severity: 'huge' }).success).toBe(false);
		const [before] = await database.db.select().from(drawings).where(eq(drawings.id, drawing.id));
		const cases: [Record<string, unknown>, string, RegExp][] = [
			[{ assigneeId: '00000000-0000-4000-8000-000000000000' }, 'assigneeId', /not a member/],
			[{ assigneeId: stranger.id }, 'assigneeId', /not a member/],
			[{ assigneeId: people.quality.id }, 'assigneeId', /Supplier quality.*does not answer/],
			[{ featureId: '00000000-0000-4000-8000-000000000000' }, 'featureId', /no feature/],
			[{ fitId: '00000000-0000-4000-8000-000000000000' }, 'fitId', /no fit/],
			[{ location: { sheet: 3, x: 0.5, y: 0.5 } }, 'location', /2 sheets/]
		];
		for (const [data, field, message] of cases) {
			const refused = await raiseFinding(
				database.db,
				people.checker,
				place,
				input({ text: 'x', severity: 'major', ...data })
			);
			expect(refused).toMatchObject({ ok: false, status: 400, code: 'invalid', field });
			expect(!refused.ok && refused.message).toMatch(message);
		}
		expect(await findingsOf(database.db, place)).toEqual([]);
		const [after] = await database.db.select().from(drawings).where(eq(drawings.id, drawing.id));
		expect(after.nextFinding).toBe(before.nextFinding);
	});
});

describe('the finding state machine for each role', () => {
	// PRODUCT.md §3: raised → answered → resolved → verified, withdrawn; reopen returns any of
	// them to raised. §2: answering is for the assignee (admin, drafter, checker); resolve,
	// verify, withdraw and reopen for checker and admin.
	const machine: Record<FindingState, FindingState[]> = {
		raised: ['answered', 'withdrawn'],
		answered: ['resolved', 'withdrawn', 'raised'],
		resolved: ['verified', 'raised'],
		verified: ['raised'],
		withdrawn: ['raised']
	};
	const mayMoveTo: Record<Role, FindingState[]> = {
		admin: ['answered', 'resolved', 'verified', 'withdrawn', 'raised'],
		drafter: ['answered'],
		checker: ['answered', 'resolved', 'verified', 'withdrawn', 'raised'],
		quality: []
	};
	const expected = (role: Role, from: FindingState, to: FindingState) =>
		!mayMoveTo[role].includes(to) ? 403 : machine[from].includes(to) ? 200 : 409;

	for (const role of ['admin', 'drafter', 'checker', 'quality'] as const) {
		it(role, async () => {
			const place = await newRevision();
			const seen: string[] = [];
			const wanted: string[] = [];
			for (const from of findingStates) {
				for (const to of findingStates) {
					const raised = await raise(place, {
						assigneeId: people[role === 'quality' ? 'drafter' : role].id
					});
					await database.db.update(findings).set({ state: from }).where(eq(findings.id, raised.id));
					const finding = { ...raised, state: from };
					const outcome = await changeFinding(
						database.db,
						asker(role),
						place,
						finding,
						patch({ state: to, message: 'Because the drawing changed', version: 1 })
					);
					seen.push(`${from}→${to}: ${outcome.ok ? 200 : outcome.status}`);
					wanted.push(`${from}→${to}: ${expected(role, from, to)}`);
					const stored = (await getFinding(database.db, place.revision.id, raised.id))!;
					if (outcome.ok) {
						expect(stored).toMatchObject({ state: to, version: 2 });
						expect(outcome.finding.history).toEqual([
							expect.objectContaining({
								from,
								to,
								message: 'Because the drawing changed',
								by: people[role].id,
								byName: people[role].name
							})
						]);
					} else {
						expect(stored).toMatchObject({ state: from, version: 1 });
						if (outcome.status === 409) expect(outcome.code).toBe('invalid_transition');
						if (outcome.status === 403) expect(outcome.code).toBe('forbidden');
					}
				}
			}
			expect(seen).toEqual(wanted);
		});
	}

	it('lets only the assignee answer, and records the move on the trail', async () => {
		const place = await newRevision();
		const finding = await raise(place, { assigneeId: people.drafter.id });
		const byChecker = await changeFinding(
			database.db,
			asker('checker'),
			place,
			finding,
			patch({ state: 'answered', version: 1 })
		);
		expect(byChecker).toMatchObject({ ok: false, status: 403, code: 'forbidden' });
		const answered = await changeFinding(
			database.db,
			asker('drafter'),
			place,
			finding,
			patch({ state: 'answered', message: 'Tolerance added in the next revision', version: 1 })
		);
		expect(answered).toMatchObject({ ok: true, finding: { state: 'answered', version: 2 } });
		const [entry] = await database.db
			.select()
			.from(activity)
			.where(eq(activity.entityId, finding.id))
			.orderBy(desc(activity.id))
			.limit(1);
		expect(entry).toMatchObject({ action: 'state', actorId: people.drafter.id });
		expect(entry.before).toMatchObject({ state: 'raised', version: 1 });
		expect(entry.after).toMatchObject({
			state: 'answered',
			version: 2,
			message: 'Tolerance added in the next revision'
		});
	});

	it('needs a message to withdraw or reopen', async () => {
		const place = await newRevision();
		const finding = await raise(place);
		for (const state of ['withdrawn', 'raised'] as const) {
			const refused = await changeFinding(
				database.db,
				asker('checker'),
				place,
				{ ...finding, state: state === 'raised' ? 'verified' : 'raised' },
				patch({ state, message: '  ', version: 1 })
			);
			expect(refused).toMatchObject({ ok: false, status: 400, field: 'message' });
		}
		expect((await getFinding(database.db, place.revision.id, finding.id))!.version).toBe(1);
	});

	it('answers 409 stale with the current finding, and 409 frozen once the revision is approved', async () => {
		const place = await newRevision();
		const finding = await raise(place);
		await changeFinding(
			database.db,
			asker('checker'),
			place,
			finding,
			patch({ state: 'withdrawn', message: 'Duplicate of F-1', version: 1 })
		);
		const stale = await changeFinding(
			database.db,
			asker('checker'),
			place,
			finding,
			patch({ severity: 'critical', version: 1 })
		);
		expect(stale).toMatchObject({
			ok: false,
			status: 409,
			code: 'stale',
			current: { id: finding.id, state: 'withdrawn', version: 2 }
		});
		await database.db
			.update(revisions)
			.set({ state: 'approved' })
			.where(eq(revisions.id, place.revision.id));
		const frozen = { ...place, revision: { ...place.revision, state: 'approved' as const } };
		const fresh = (await getFinding(database.db, place.revision.id, finding.id))!;
		for (const outcome of [
			await raiseFinding(
				database.db,
				people.checker,
				frozen,
				input({ text: 'x', severity: 'note' })
			),
			await changeFinding(
				database.db,
				asker('checker'),
				frozen,
				fresh,
				patch({ state: 'raised', message: 'Back', version: 2 })
			),
			await changeFinding(
				database.db,
				asker('checker'),
				frozen,
				fresh,
				patch({ text: 'Edited', version: 2 })
			)
		]) {
			expect(outcome).toMatchObject({ ok: false, status: 409, code: 'frozen' });
		}
		expect(await findingsOf(database.db, place)).toHaveLength(1);
	});
});

describe('editing and waiving findings', () => {
	it('is for whoever raised the finding or a checker, with references checked', async () => {
		const place = await newRevision();
		const finding = await raise(place);
		const byDrafter = await changeFinding(
			database.db,
			asker('drafter'),
			place,
			finding,
			patch({ severity: 'note', version: 1 })
		);
		expect(byDrafter).toMatchObject({ ok: false, status: 403 });
		const badAssignee = await changeFinding(
			database.db,
			asker('checker'),
			place,
			finding,
			patch({ assigneeId: people.quality.id, version: 1 })
		);
		expect(badAssignee).toMatchObject({ ok: false, status: 400, field: 'assigneeId' });
		const edited = await changeFinding(
			database.db,
			asker('checker'),
			place,
			finding,
			patch({ severity: 'critical', location: { sheet: 1, x: 0.5, y: 0.5 }, version: 1 })
		);
		expect(edited).toMatchObject({
			ok: true,
			finding: { severity: 'critical', location: { sheet: 1, x: 0.5, y: 0.5 }, version: 2 }
		});
		const [entry] = await database.db
			.select()
			.from(activity)
			.where(and(eq(activity.entityId, finding.id), eq(activity.action, 'update')));
		expect(entry.before).toMatchObject({ severity: 'major', location: null });
		expect(entry.after).toMatchObject({ severity: 'critical' });
	});

	it('waives open rule findings only, by a checker', async () => {
		const place = await newRevision();
		const manual = await raise(place);
		const refused = await changeFinding(
			database.db,
			asker('checker'),
			place,
			manual,
			patch({ waiver: { reason: 'Accepted by the customer' }, version: 1 })
		);
		expect(refused).toMatchObject({ ok: false, status: 409, code: 'invalid_transition' });
		// A rule finding as the rulebook will store it (a later issue raises them).
		await database.db
			.update(findings)
			.set({ kind: 'rule', rule: 'LIM-03', ruleKey: 'LIM-03:feature:x:places' })
			.where(eq(findings.id, manual.id));
		const rule = (await getFinding(database.db, place.revision.id, manual.id))!;
		const byDrafter = await changeFinding(
			database.db,
			asker('drafter'),
			place,
			rule,
			patch({ waiver: { reason: 'x' }, version: 1 })
		);
		expect(byDrafter).toMatchObject({ ok: false, status: 403 });
		const waived = await changeFinding(
			database.db,
			asker('checker'),
			place,
			rule,
			patch({ waiver: { reason: 'Accepted by the customer' }, version: 1 })
		);
		expect(waived).toMatchObject({
			ok: true,
			finding: {
				state: 'raised',
				waiver: { by: people.checker.id, reason: 'Accepted by the customer' }
			}
		});
		expect(
			await findingsOf(database.db, place, findingQuery.parse({ rule: 'lim-03' }))
		).toHaveLength(1);
	});
});

describe('the findings table filters', () => {
	it('by kind, state (open = raised or answered), severity, assignee, rule and feature', async () => {
		const place = await newRevision();
		const feature = await addFeature(
			database.db,
			people.drafter,
			{ ...place, team },
			featureInput.parse({ kind: 'pin', callout: 'Ø6 g6' })
		);
		if (!feature.ok) throw new Error(feature.message);
		const a = await raise(place, { severity: 'critical', assigneeId: people.drafter.id });
		const b = await raise(place, { severity: 'minor', featureId: feature.feature.id });
		const c = await raise(place, { severity: 'note' });
		await changeFinding(
			database.db,
			asker('drafter'),
			place,
			a,
			patch({ state: 'answered', version: 1 })
		);
		await changeFinding(
			database.db,
			asker('checker'),
			place,
			c,
			patch({ state: 'withdrawn', message: 'Not a problem', version: 1 })
		);
		const numbers = async (query: Record<string, string>) =>
			(await findingsOf(database.db, place, findingQuery.parse(query))).map((f) => f.number);
		expect(await numbers({})).toEqual([a.number, b.number, c.number]);
		expect(await numbers({ state: 'open' })).toEqual([a.number, b.number]);
		expect(await numbers({ state: 'answered,withdrawn' })).toEqual([a.number, c.number]);
		expect(await numbers({ severity: 'critical,note' })).toEqual([a.number, c.number]);
		expect(await numbers({ assigneeId: people.drafter.id })).toEqual([a.number]);
		expect(await numbers({ assigneeId: 'none' })).toEqual([b.number, c.number]);
		expect(await numbers({ featureId: feature.feature.id })).toEqual([b.number]);
		expect(await numbers({ kind: 'manual', state: 'open', severity: 'minor' })).toEqual([b.number]);
		expect(await numbers({ kind: 'rule' })).toEqual([]);
		expect(findingQuery.safeParse({ state: 'closed' }).success).toBe(false);
		expect(findingQuery.safeParse({ rule: 'nonsense' }).success).toBe(false);
	});

	it("count each feature's open findings in one grouped query (the features table)", async () => {
		const place = await newRevision();
		const add = async (callout: string) => {
			const added = await addFeature(
				database.db,
				people.drafter,
				{ ...place, team },
				featureInput.parse({ kind: 'hole', callout })
			);
			if (!added.ok) throw new Error(added.message);
			return added.feature.id;
		};
		const bore = await add('Ø12 H7');
		const dowel = await add('Ø6 H7');
		const quiet = await add('Ø8 H7');
		await raise(place, { featureId: bore });
		const answered = await raise(place, { featureId: bore, assigneeId: people.drafter.id });
		await changeFinding(database.db, asker('drafter'), place, answered, {
			state: 'answered',
			version: 1
		});
		const withdrawn = await raise(place, { featureId: dowel });
		await changeFinding(database.db, asker('checker'), place, withdrawn, {
			state: 'withdrawn',
			message: 'Not a problem',
			version: 1
		});
		await raise(place);
		const open = await openFindingsByFeature(database.db, place.revision.id);
		// Raised and answered count as open; withdrawn does not; findings on no feature are left out.
		expect(Object.fromEntries(open)).toEqual({ [bore]: 2 });
		expect(open.get(quiet)).toBeUndefined();
		// Another revision's findings are not this one's.
		expect((await openFindingsByFeature(database.db, (await newRevision()).revision.id)).size).toBe(
			0
		);
	});
});

describe('threads', () => {
	it('keep the body as typed and answer it rendered, with scripts and handlers inert', async () => {
		const place = await newRevision();
		const finding = await raise(place);
		const thread = findingThread(place, finding);
		const body =
			'Please check **both** ends:\n\n- `Ø12 g6`\n- the keyway\n\n<script>alert("x")</script>\n\n<img src=x onerror="alert(1)">\n\n[docs](javascript:alert(1)) and <https://example.test/spec>';
		const posted = await addComment(database.db, asker('checker'), thread, body);
		if (!posted.ok) throw new Error(posted.message);
		const { comment } = posted;
		expect(comment.body).toBe(body);
		expect(comment.authorId).toBe(people.checker.id);
		expect(comment.editedAt).toBeNull();
		expect(comment.html).toContain('<strong>both</strong>');
		expect(comment.html).toContain('<li><code>Ø12 g6</code></li>');
		expect(comment.html).toContain(
			'<a href="https://example.test/spec" rel="nofollow noopener noreferrer" target="_blank">'
		);
		// No element or attribute that runs anything: the markup is shown as text.
		expect(comment.html).not.toMatch(/<script/i);
		expect(comment.html).not.toMatch(/<img/i);
		expect(comment.html).not.toMatch(/<[^>]*\son\w+\s*=/i);
		expect(comment.html).not.toMatch(/href="javascript:/i);
		expect(comment.html).toContain('&lt;script&gt;');
		expect(await commentsOf(database.db, thread)).toEqual([comment]);
	});

	it('resolve mentions to members of the team only', async () => {
		const place = await newRevision();
		const finding = await raise(place);
		const posted = await addComment(
			database.db,
			asker('checker'),
			findingThread(place, finding),
			'@tomas please answer; cc @quality and @sam, and mail ops@example.test'
		);
		if (!posted.ok) throw new Error(posted.message);
		const [row] = await database.db
			.select()
			.from(comments)
			.where(eq(comments.id, posted.comment.id));
		// Sam is a user, but of another team: his name stays plain text.
		expect(row.mentions.sort()).toEqual([people.drafter.id, people.quality.id].sort());
		expect(posted.comment.html).toContain(
			`<span class="mention" data-user-id="${people.drafter.id}" title="Tomas Reyes">@tomas</span>`
		);
		expect(posted.comment.html).toContain('@sam');
		expect(posted.comment.html).not.toContain(stranger.id);
		expect(posted.comment.html).toContain('ops@example.test');
		expect(posted.comment.html.match(/class="mention"/g)).toHaveLength(2);
	});

	it('let authors edit their own comment for 10 minutes, shown as edited', async () => {
		const place = await newRevision();
		const finding = await raise(place);
		const thread = findingThread(place, finding);
		const posted = await addComment(database.db, asker('drafter'), thread, 'Fixed in rev B');
		if (!posted.ok) throw new Error(posted.message);
		const row = (await getComment(database.db, thread.subject, posted.comment.id))!;
		const byOther = await editComment(database.db, people.checker, thread, row, 'Not fixed');
		expect(byOther).toMatchObject({ ok: false, status: 403 });
		const edited = await editComment(database.db, people.drafter, thread, row, 'Fixed in rev C');
		expect(edited).toMatchObject({ ok: true, comment: { body: 'Fixed in rev C' } });
		expect(edited.ok && edited.comment.editedAt).toBeTruthy();
		const [entry] = await database.db
			.select()
			.from(activity)
			.where(and(eq(activity.entityId, row.id), eq(activity.action, 'update')));
		expect(entry.before).toMatchObject({ body: 'Fixed in rev B' });
		expect(entry.after).toMatchObject({ body: 'Fixed in rev C' });
		const old = { ...row, createdAt: new Date(Date.now() - 11 * 60_000) };
		const late = await editComment(database.db, people.drafter, thread, old, 'Too late');
		expect(late).toMatchObject({ ok: false, status: 409, code: 'too_late' });
		expect((await getComment(database.db, thread.subject, row.id))!.body).toBe('Fixed in rev C');
	});

	it('on features, and by supplier quality on released revisions only', async () => {
		const place = await newRevision();
		const feature = await addFeature(
			database.db,
			people.drafter,
			{ ...place, team },
			featureInput.parse({ kind: 'hole', callout: 'Ø8 H7' })
		);
		if (!feature.ok) throw new Error(feature.message);
		const featureRow = { ...feature.feature, createdAt: new Date(), updatedAt: new Date() };
		const thread = featureThread(place, featureRow as never);
		const draft = await addComment(database.db, asker('quality'), thread, 'Gauge?');
		expect(draft).toMatchObject({ ok: false, status: 403 });
		const released = { ...thread, revision: { ...place.revision, state: 'released' as const } };
		const posted = await addComment(database.db, asker('quality'), released, 'Which gauge for #1?');
		expect(posted).toMatchObject({ ok: true, comment: { authorId: people.quality.id } });
		expect((await commentsOf(database.db, thread)).map((c) => c.body)).toEqual([
			'Which gauge for #1?'
		]);
	});
});

describe('findings by number', () => {
	it('are found on their revision only', async () => {
		const place = await newRevision();
		const finding: FindingRow = await raise(place);
		expect((await getFinding(database.db, place.revision.id, { number: finding.number }))?.id).toBe(
			finding.id
		);
		const other = await newRevision();
		expect(await getFinding(database.db, other.revision.id, { number: finding.number })).toBeNull();
	});
});
