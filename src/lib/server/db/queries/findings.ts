import { and, asc, eq, inArray, isNotNull, isNull, like, sql, type SQL } from 'drizzle-orm';
import { canMove, findingName, openStates, type FindingState } from '$lib/findings';
import type { FindingQuery } from '$lib/schemas/findings';
import type { Db } from '../connect';
import {
	drawings,
	findingMoves,
	findings,
	users,
	type DrawingRow,
	type FindingRow,
	type RevisionRow
} from '../schema';
import type { Actor } from './activity';
import { StaleWrite, writeOnRevision } from './revision-writes';

export type FindingValues = Omit<
	typeof findings.$inferInsert,
	| 'id'
	| 'teamId'
	| 'drawingId'
	| 'revisionId'
	| 'number'
	| 'state'
	| 'version'
	| 'raisedBy'
	| 'createdAt'
	| 'updatedAt'
>;

/** A state change the machine does not have (PRODUCT.md §3). */
export class InvalidMove extends Error {
	constructor(
		readonly current: FindingRow,
		readonly to: FindingState
	) {
		super(`A ${current.state} finding cannot become ${to}`);
	}
}

/** The revision's findings matching every filter given, by number. */
export async function listFindings(db: Db, revisionId: string, query: FindingQuery = {}) {
	const where: (SQL | undefined)[] = [eq(findings.revisionId, revisionId)];
	if (query.kind) where.push(eq(findings.kind, query.kind));
	if (query.state) {
		const states = query.state.flatMap((s) => (s === 'open' ? openStates : [s as FindingState]));
		where.push(inArray(findings.state, states));
	}
	if (query.severity)
		where.push(inArray(findings.severity, query.severity as FindingRow['severity'][]));
	if (query.assigneeId === 'none') where.push(isNull(findings.assigneeId));
	else if (query.assigneeId) where.push(eq(findings.assigneeId, query.assigneeId));
	if (query.rule) where.push(eq(findings.rule, query.rule));
	if (query.family) where.push(like(findings.rule, `${query.family}-%`));
	if (query.waived)
		where.push(query.waived === 'true' ? isNotNull(findings.waiver) : isNull(findings.waiver));
	if (query.featureId) where.push(eq(findings.featureId, query.featureId));
	if (query.fitId) where.push(eq(findings.fitId, query.fitId));
	return db
		.select()
		.from(findings)
		.where(and(...where))
		.orderBy(asc(findings.number));
}

/** Open findings (raised or answered) per feature of the revision: one grouped query. */
export async function openFindingsByFeature(db: Db, revisionId: string) {
	const rows = await db
		.select({ featureId: findings.featureId, count: sql<number>`count(*)::int` })
		.from(findings)
		.where(
			and(
				eq(findings.revisionId, revisionId),
				inArray(findings.state, [...openStates]),
				isNotNull(findings.featureId)
			)
		)
		.groupBy(findings.featureId);
	return new Map(rows.map((r) => [r.featureId!, Number(r.count)]));
}

/** Severities that hold up an approval while a finding of theirs is open (PRODUCT.md §3). */
export const blockingSeverities = ['critical', 'major'] as const;

/**
 * The findings that refuse an approval: critical or major, open (raised or answered) and not
 * waived, by number. The one place the approval gate asks.
 */
export async function blockingFindings(db: Db, revisionId: string) {
	return db
		.select()
		.from(findings)
		.where(
			and(
				eq(findings.revisionId, revisionId),
				inArray(findings.severity, blockingSeverities),
				inArray(findings.state, [...openStates]),
				isNull(findings.waiver)
			)
		)
		.orderBy(asc(findings.number));
}

/** A finding of the revision by its id or its number. */
export async function getFinding(db: Db, revisionId: string, which: string | { number: number }) {
	const [row] = await db
		.select()
		.from(findings)
		.where(
			and(
				eq(findings.revisionId, revisionId),
				typeof which === 'string' ? eq(findings.id, which) : eq(findings.number, which.number)
			)
		);
	return row ?? null;
}

/** A finding's state changes, oldest first, with who made each. */
export async function listMoves(db: Db, findingId: string) {
	return db
		.select({
			from: findingMoves.from,
			to: findingMoves.to,
			message: findingMoves.message,
			by: findingMoves.byId,
			byName: sql<string | null>`coalesce(${users.name}, ${users.email})`,
			at: findingMoves.at
		})
		.from(findingMoves)
		.leftJoin(users, eq(users.id, findingMoves.byId))
		.where(eq(findingMoves.findingId, findingId))
		.orderBy(asc(findingMoves.id));
}

/** The stored record as the trail keeps it (before and after). */
export function storedFinding(row: FindingRow) {
	return {
		id: row.id,
		number: row.number,
		kind: row.kind,
		rule: row.rule ?? null,
		severity: row.severity,
		state: row.state,
		text: row.text,
		featureId: row.featureId ?? null,
		fitId: row.fitId ?? null,
		assigneeId: row.assigneeId ?? null,
		raisedBy: row.raisedBy ?? null,
		location: row.location ?? null,
		waiver: row.waiver ?? null,
		carried: row.carried ?? null,
		version: row.version
	};
}

const name = (row: FindingRow) => findingName(row.number);
const where = (revision: RevisionRow, drawing: DrawingRow) =>
	`revision ${revision.letter} of ${drawing.number}`;

/** Raises a finding with the drawing's next finding number: counted, never reused. */
export async function createFinding(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	values: FindingValues
) {
	return writeOnRevision<FindingRow>(
		db,
		{ actor, drawing, revision },
		{
			entity: 'finding',
			write: async (tx) => {
				const [counter] = await tx
					.update(drawings)
					.set({ nextFinding: sql`${drawings.nextFinding} + 1` })
					.where(eq(drawings.id, drawing.id))
					.returning({ next: drawings.nextFinding });
				return tx
					.insert(findings)
					.values({
						...values,
						teamId: drawing.teamId,
						drawingId: drawing.id,
						revisionId: revision.id,
						number: counter.next - 1,
						raisedBy: actor.id
					})
					.returning();
			},
			record: (row) => ({
				action: 'create',
				summary: `raised ${name(row)} (${row.severity}) on ${where(revision, drawing)}`,
				after: storedFinding(row)
			})
		}
	);
}

export type FindingEdit = 'update' | 'waive' | 'unwaive';

interface Change {
	set: Partial<typeof findings.$inferInsert>;
	action: string;
	/** The trail's words for what was done, e.g. "edited F-3". */
	summary: (row: FindingRow) => string;
	/** Refuses the change on the locked row (by throwing). */
	check?: (before: FindingRow) => void;
	/** More written in the same transaction once the row is. */
	also?: (tx: Db, before: FindingRow, row: FindingRow) => Promise<void>;
	/** More for the trail's `after`. */
	note?: Record<string, unknown>;
}

/**
 * One change of a finding made against `version` (the revision's shared write: revision locked,
 * frozen refused, trail written): the row is locked and its version checked first, so a move is
 * judged on the state it really has.
 */
async function writeFinding(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	finding: FindingRow,
	version: number,
	change: Change
) {
	let before = finding;
	return writeOnRevision<FindingRow>(
		db,
		{ actor, drawing, revision },
		{
			entity: 'finding',
			check: async (tx) => {
				const [current] = await tx
					.select()
					.from(findings)
					.where(eq(findings.id, finding.id))
					.for('update');
				if (current?.version !== version) throw new StaleWrite(current ?? null, 'finding');
				change.check?.(current);
				before = current;
			},
			write: async (tx) => {
				const rows = await tx
					.update(findings)
					.set({ ...change.set, version: sql`${findings.version} + 1`, updatedAt: new Date() })
					.where(eq(findings.id, finding.id))
					.returning();
				await change.also?.(tx, before, rows[0]);
				return rows;
			},
			record: (row) => ({
				action: change.action,
				summary: `${change.summary(row)} on ${where(revision, drawing)}`,
				before: storedFinding(before),
				after: { ...storedFinding(row), ...change.note }
			})
		}
	);
}

/** Edits the finding's fields or its waiver, made against `version`. */
export async function updateFinding(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	finding: FindingRow,
	version: number,
	changes: Partial<FindingValues>,
	action: FindingEdit = 'update'
) {
	const verb = { update: 'edited', waive: 'waived', unwaive: 'took back the waiver of' }[action];
	return writeFinding(db, actor, drawing, revision, finding, version, {
		set: changes,
		action,
		summary: (row) => `${verb} ${name(row)}`,
		// Waivers are kept in the finding's history beside its state changes.
		also:
			action === 'update'
				? undefined
				: async (tx, before, row) => {
						const message = row.waiver
							? `Waived: ${row.waiver.reason}`
							: `Waiver taken back (it was: ${before.waiver?.reason ?? ''})`;
						await tx.insert(findingMoves).values({
							findingId: row.id,
							from: row.state,
							to: row.state,
							message,
							byId: actor.id
						});
					}
	});
}

/** Moves the finding to `to` if the machine has that move from its current state. */
export async function moveFinding(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	finding: FindingRow,
	version: number,
	to: FindingState,
	message: string
) {
	return writeFinding(db, actor, drawing, revision, finding, version, {
		set: { state: to },
		action: 'state',
		check: (before) => {
			if (!canMove(before.state, to)) throw new InvalidMove(before, to);
		},
		also: async (tx, before, row) => {
			await tx
				.insert(findingMoves)
				.values({ findingId: row.id, from: before.state, to, message, byId: actor.id });
		},
		summary: (row) =>
			`moved ${name(row)} from ${finding.state} to ${to}${message ? ` (${message})` : ''}`,
		note: { message }
	});
}
