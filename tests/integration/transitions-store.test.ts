import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import {
	activity,
	findings,
	revisions,
	teams,
	type DrawingRow,
	type RevisionRow,
	type Role
} from '../../src/lib/server/db/schema';
import {
	createDrawing,
	getRevision,
	insertRevision
} from '../../src/lib/server/db/queries/drawings';
import { addMember, createTeam } from '../../src/lib/server/db/queries/teams';
import { createUser } from '../../src/lib/server/db/queries/users';
import { transitionRevision, transitionsOf } from '../../src/lib/server/transitions';
import { addComment, findingThread } from '../../src/lib/server/comments';
import { raiseFinding } from '../../src/lib/server/findings';
import { transitionInput } from '../../src/lib/schemas/transitions';
import { findingInput } from '../../src/lib/schemas/findings';
import { revisionStates, type RevisionState } from '../../src/lib/revisions';
import { freshDatabase } from './harness';

type User = { id: string; name: string | null; email: string };
const roles: Role[] = ['admin', 'drafter', 'checker', 'quality'];

let database: Database;
const people = {} as Record<Role, User>;
let team: Awaited<ReturnType<typeof createTeam>>;
let drawingCount = 0;

async function user(name: string, email: string) {
	return (await createUser(database.db, { name, email, passwordHash: null }))!;
}

async function newDrawing(): Promise<DrawingRow> {
	return createDrawing(database.db, people.drafter, team.id, {
		number: `T-${++drawingCount}`,
		title: 'Cover plate',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm' }
	});
}

const sheet = { width: 1190.55, height: 841.89 };

/** A revision uploaded by the drafter, put straight into `state` (a fixture, not a move). */
async function revisionIn(state: RevisionState, drawing?: DrawingRow, letter = 'A') {
	const onDrawing = drawing ?? (await newDrawing());
	const row = await insertRevision(database.db, people.drafter, onDrawing, {
		letter,
		pages: 1,
		sheets: [sheet],
		sha256: `${letter}${drawingCount}`.padEnd(64, '0'),
		size: 1000,
		storageKey: `test/${drawingCount}/${letter}.pdf`
	});
	const [moved] = await database.db
		.update(revisions)
		.set({ state })
		.where(eq(revisions.id, row.id))
		.returning();
	return { team, drawing: onDrawing, revision: moved };
}

async function currentTeam() {
	const [row] = await database.db.select().from(teams).where(eq(teams.id, team.id));
	return row;
}

async function move(
	role: Role,
	place: { drawing: DrawingRow; revision: RevisionRow },
	to: string,
	message = 'Checked against the title block'
) {
	return transitionRevision(
		database.db,
		{ user: people[role], role },
		{ ...place, team: await currentTeam() },
		transitionInput.parse({ to, message })
	);
}

/** A finding the checker raised on the revision. */
async function raise(place: { drawing: DrawingRow; revision: RevisionRow }, severity: string) {
	const raised = await raiseFinding(
		database.db,
		people.checker,
		{ ...place, team },
		findingInput.parse({ text: 'Slot width has no limits', severity })
	);
	if (!raised.ok) throw new Error(raised.message);
	return raised.finding;
}

const stateOf = async (revision: RevisionRow) =>
	(await database.db.select().from(revisions).where(eq(revisions.id, revision.id)))[0];

beforeAll(async () => {
	database = await freshDatabase();
	people.admin = await user('Ada Admin', 'ada@example.test');
	people.drafter = await user('Tomas Reyes', 'drafter@example.test');
	people.checker = await user('Priya Natarajan', 'checker@example.test');
	people.quality = await user('Ken Halloran', 'quality@example.test');
	team = await createTeam(database.db, people.admin, { slug: 'acme', name: 'Acme' });
	for (const role of ['drafter', 'checker', 'quality'] as const) {
		await addMember(database.db, people.admin, team.id, people[role], role);
	}
});
afterAll(() => database?.close());

/**
 * The machine and who may make each move, written out from PRODUCT.md §2 and §3 (not read from
 * the code): submit and resubmit by those who upload (admin, drafter); return, approve,
 * release and reopen by those who decide (admin, checker); superseding happens on release only.
 */
const allowed: Record<string, Role[]> = {
	'draft>in-check': ['admin', 'drafter'],
	'in-check>returned': ['admin', 'checker'],
	'in-check>approved': ['admin', 'checker'],
	'returned>in-check': ['admin', 'drafter'],
	'approved>released': ['admin', 'checker'],
	'approved>in-check': ['admin', 'checker']
};

describe('every transition × every role', () => {
	const cases = revisionStates.flatMap((from) =>
		revisionStates.flatMap((to) => roles.map((role) => ({ from, to, role })))
	);
	it.each(cases)('$from → $to by $role', async ({ from, to, role }) => {
		const place = await revisionIn(from);
		const outcome = await move(role, place, to);
		const edge = allowed[`${from}>${to}`];
		if (role === 'quality') {
			expect(outcome).toMatchObject({ ok: false, status: 403, code: 'forbidden' });
		} else if (!edge) {
			expect(outcome).toMatchObject({ ok: false, status: 409, code: 'invalid_transition' });
		} else if (!edge.includes(role)) {
			expect(outcome).toMatchObject({ ok: false, status: 403, code: 'forbidden' });
		} else {
			expect(outcome).toMatchObject({
				ok: true,
				transition: { from, to, by: people[role].id, message: 'Checked against the title block' },
				revision: { state: to }
			});
		}
		const after = await stateOf(place.revision);
		expect(after.state).toBe(outcome.ok ? to : from);
		const history = await transitionsOf(database.db, place.revision.id);
		expect(history).toHaveLength(outcome.ok ? 1 : 0);
	});
});

describe('messages', () => {
	it.each([
		['in-check', 'returned'],
		['approved', 'in-check']
	] as const)('%s → %s needs a message; without one nothing changes', async (from, to) => {
		const place = await revisionIn(from);
		const outcome = await move('checker', place, to, '   ');
		expect(outcome).toMatchObject({ ok: false, status: 400, code: 'invalid', field: 'message' });
		expect((await stateOf(place.revision)).state).toBe(from);
		expect(await transitionsOf(database.db, place.revision.id)).toEqual([]);
	});

	it('keeps who, when and why in the history and on the trail', async () => {
		const place = await revisionIn('draft');
		expect((await move('drafter', place, 'in-check', '')).ok).toBe(true);
		const returned = await move('checker', place, 'returned', 'Slot width has no tolerance');
		expect(returned.ok).toBe(true);
		const history = await transitionsOf(database.db, place.revision.id);
		expect(history).toMatchObject([
			{ from: 'draft', to: 'in-check', name: 'submit', message: '', byName: 'Tomas Reyes' },
			{
				from: 'in-check',
				to: 'returned',
				name: 'return',
				message: 'Slot width has no tolerance',
				by: people.checker.id,
				byName: 'Priya Natarajan'
			}
		]);
		expect(Date.now() - Date.parse(history[1].at)).toBeLessThan(60_000);
		const trail = await database.db
			.select()
			.from(activity)
			.where(eq(activity.entityId, place.revision.id));
		expect(trail.map((row) => row.action)).toEqual(['upload', 'submit', 'return']);
		expect(trail[2].summary).toBe(
			`returned revision A of ${place.drawing.number}: Slot width has no tolerance`
		);
	});
});

describe('the approval gate', () => {
	async function withFinding(values: Partial<typeof findings.$inferInsert>) {
		const place = await revisionIn('in-check');
		const finding = await raise(place, 'critical');
		await database.db.update(findings).set(values).where(eq(findings.id, finding.id));
		return { place, number: finding.number };
	}

	it.each([
		['an open critical', { severity: 'critical', state: 'raised' }],
		['an answered major', { severity: 'major', state: 'answered' }]
	] as const)('refuses %s, listing it', async (_what, values) => {
		const { place, number } = await withFinding(values);
		const outcome = await move('checker', place, 'approved');
		expect(outcome).toMatchObject({
			ok: false,
			status: 409,
			code: 'open_findings',
			findings: [{ number, severity: values.severity, state: values.state }]
		});
		expect((await stateOf(place.revision)).state).toBe('in-check');
	});

	it.each([
		['a waived critical', { waiver: { by: null, at: '2026-01-01T00:00:00Z', reason: 'Agreed' } }],
		['a resolved critical', { state: 'resolved' }],
		['a withdrawn critical', { state: 'withdrawn' }],
		['an open minor', { severity: 'minor' }],
		['an open note', { severity: 'note' }]
	] as const)('passes %s', async (_what, values) => {
		const { place } = await withFinding(values);
		const outcome = await move('checker', place, 'approved');
		expect(outcome).toMatchObject({ ok: true, revision: { state: 'approved' } });
		const approved = await stateOf(place.revision);
		expect(approved.approvedBy).toBe(people.checker.id);
		expect(Date.now() - approved.approvedAt!.getTime()).toBeLessThan(60_000);
	});
});

describe('separation of duties', () => {
	it('refuses the uploader and the submitter, unless the team allows self-approval', async () => {
		// The admin uploads and submits, then tries to approve.
		const drawing = await newDrawing();
		const uploaded = await insertRevision(database.db, people.admin, drawing, {
			letter: 'A',
			pages: 1,
			sheets: [sheet],
			sha256: 'u'.repeat(64),
			size: 1,
			storageKey: 'test/self.pdf'
		});
		const own = { drawing, revision: uploaded };
		expect((await move('admin', own, 'in-check')).ok).toBe(true);
		expect(await move('admin', own, 'approved')).toMatchObject({
			ok: false,
			status: 403,
			code: 'separation_of_duties'
		});

		// The drafter uploaded; the admin submitted it: the admin still may not approve.
		const submitted = await revisionIn('draft');
		expect((await move('admin', submitted, 'in-check')).ok).toBe(true);
		const refused = await move('admin', submitted, 'approved');
		expect(refused).toMatchObject({ status: 403, code: 'separation_of_duties' });
		expect((await stateOf(submitted.revision)).state).toBe('in-check');

		await database.db.update(teams).set({ allowSelfApproval: true }).where(eq(teams.id, team.id));
		try {
			expect(await move('admin', own, 'approved')).toMatchObject({ ok: true });
			expect(await move('admin', submitted, 'approved')).toMatchObject({ ok: true });
		} finally {
			await database.db
				.update(teams)
				.set({ allowSelfApproval: false })
				.where(eq(teams.id, team.id));
		}
	});

	it('lets the checker approve what the drafter uploaded and submitted', async () => {
		const place = await revisionIn('draft');
		expect((await move('drafter', place, 'in-check')).ok).toBe(true);
		expect(await move('checker', place, 'approved')).toMatchObject({ ok: true });
	});
});

describe('release', () => {
	it('records who released, and supersedes the previously released revision', async () => {
		const a = await revisionIn('approved');
		expect(await move('checker', a, 'released')).toMatchObject({
			ok: true,
			revision: { state: 'released', releasedBy: people.checker.id }
		});
		const b = await revisionIn('approved', a.drawing, 'B');
		expect(await move('admin', b, 'released')).toMatchObject({ ok: true });
		expect((await stateOf(a.revision)).state).toBe('superseded');
		expect((await stateOf(b.revision)).state).toBe('released');
		expect(await transitionsOf(database.db, a.revision.id)).toMatchObject([
			{ to: 'released', by: people.checker.id },
			{ from: 'released', to: 'superseded', name: 'supersede', message: 'Revision B released' }
		]);
		// Another drawing's release supersedes nothing here.
		const other = await revisionIn('approved');
		expect((await move('checker', other, 'released')).ok).toBe(true);
		expect((await stateOf(b.revision)).state).toBe('released');
	});

	it('clears the approval when a checker reopens it', async () => {
		const place = await revisionIn('in-check');
		expect((await move('checker', place, 'approved')).ok).toBe(true);
		expect((await move('checker', place, 'in-check', 'Bore tolerance again')).ok).toBe(true);
		const reopened = await stateOf(place.revision);
		expect(reopened).toMatchObject({ state: 'in-check', approvedBy: null, approvedAt: null });
	});

	it('judges the move on the state the revision has now, not the one the asker loaded', async () => {
		const place = await revisionIn('in-check');
		const stale = { ...place, revision: { ...place.revision } };
		expect((await move('checker', place, 'returned', 'Fix the slot')).ok).toBe(true);
		expect(await move('checker', stale, 'approved')).toMatchObject({
			code: 'invalid_transition'
		});
		expect((await getRevision(database.db, place.drawing.id, 'A'))!.state).toBe('returned');
	});
});

describe('comments on frozen revisions', () => {
	it.each([
		['in-check', true],
		['approved', false],
		['released', true],
		['superseded', false]
	] as const)('on a %s revision: taken %s', async (state, taken) => {
		const place = await revisionIn('in-check');
		const finding = await raise(place, 'minor');
		const [frozen] = await database.db
			.update(revisions)
			.set({ state })
			.where(eq(revisions.id, place.revision.id))
			.returning();
		const row = (await database.db.select().from(findings).where(eq(findings.id, finding.id)))[0];
		const outcome = await addComment(
			database.db,
			{ user: people.checker, role: 'checker' },
			findingThread({ ...place, revision: frozen }, row),
			'Noted.'
		);
		expect(outcome).toMatchObject(
			taken ? { ok: true } : { ok: false, status: 409, code: 'frozen' }
		);
	});
});
