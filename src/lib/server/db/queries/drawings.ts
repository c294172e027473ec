import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../connect';
import {
	drawings,
	isFrozen,
	revisions,
	users,
	type DrawingRow,
	type RevisionRow,
	type RevisionSettings
} from '../schema';
import { recordActivity, type Actor } from './activity';
import { recheckRevision } from './rule-findings';
import { appendEvent } from './revision-events';

export type DrawingInput = Omit<
	typeof drawings.$inferInsert,
	'id' | 'teamId' | 'version' | 'nextBalloon' | 'createdBy' | 'createdAt' | 'updatedAt'
>;

/** The revision states someone who reads released revisions only may see. */
export const visibleToSuppliers = ['released', 'superseded'] as const;
export const isVisibleToSuppliers = (state: string) =>
	(visibleToSuppliers as readonly string[]).includes(state);

/** Drawings with their latest revision; `releasedOnly` hides what supplier quality may not see. */
export async function listDrawings(db: Db, teamId: string, options: { releasedOnly: boolean }) {
	const rows = await db
		.select({
			drawing: drawings,
			letter: revisions.letter,
			state: revisions.state,
			revisionAt: revisions.createdAt
		})
		.from(drawings)
		.leftJoin(
			revisions,
			and(
				eq(revisions.drawingId, drawings.id),
				options.releasedOnly ? inArray(revisions.state, visibleToSuppliers) : undefined
			)
		)
		.where(eq(drawings.teamId, teamId))
		.orderBy(asc(drawings.number), desc(revisions.createdAt));
	const latest = new Map<string, (typeof rows)[number]>();
	for (const row of rows) if (!latest.has(row.drawing.id)) latest.set(row.drawing.id, row);
	return [...latest.values()]
		.filter((row) => !options.releasedOnly || row.letter)
		.map((row) => ({
			...row.drawing,
			latest: row.letter
				? { letter: row.letter, state: row.state!, createdAt: row.revisionAt! }
				: null
		}));
}

export async function getDrawing(db: Db, teamId: string, number: string) {
	const [row] = await db
		.select()
		.from(drawings)
		.where(and(eq(drawings.teamId, teamId), eq(drawings.number, number)));
	return row ?? null;
}

export class DrawingNumberTaken extends Error {}
export class StaleEdit extends Error {
	constructor(readonly current: DrawingRow) {
		super('Someone changed this drawing since you loaded it');
	}
}

export async function createDrawing(db: Db, actor: Actor, teamId: string, input: DrawingInput) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.insert(drawings)
			.values({ ...input, teamId, createdBy: actor.id })
			.onConflictDoNothing()
			.returning();
		if (!row) throw new DrawingNumberTaken(`Drawing ${input.number} already exists in this team`);
		await recordActivity(tx, {
			teamId,
			actor,
			entity: 'drawing',
			entityId: row.id,
			drawingId: row.id,
			action: 'create',
			summary: `created drawing ${row.number} ${row.title}`,
			after: publicDrawing(row)
		});
		return row;
	});
}

/** Applies an edit made against `version`; a stale one throws with the current drawing. */
export async function updateDrawing(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	version: number,
	changes: Partial<DrawingInput>
) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.update(drawings)
			.set({ ...changes, version: sql`${drawings.version} + 1`, updatedAt: new Date() })
			.where(and(eq(drawings.id, drawing.id), eq(drawings.version, version)))
			.returning();
		if (!row) {
			const [current] = await tx.select().from(drawings).where(eq(drawings.id, drawing.id));
			throw new StaleEdit(current);
		}
		await recordActivity(tx, {
			teamId: row.teamId,
			actor,
			entity: 'drawing',
			entityId: row.id,
			drawingId: row.id,
			action: 'update',
			summary: `edited drawing ${row.number}`,
			before: publicDrawing(drawing),
			after: publicDrawing(row)
		});
		return row;
	});
}

export async function listRevisions(db: Db, drawingId: string, options: { releasedOnly: boolean }) {
	return db
		.select({ revision: revisions, uploadedByName: users.name })
		.from(revisions)
		.leftJoin(users, eq(users.id, revisions.uploadedBy))
		.where(
			and(
				eq(revisions.drawingId, drawingId),
				options.releasedOnly ? inArray(revisions.state, visibleToSuppliers) : undefined
			)
		)
		.orderBy(desc(revisions.createdAt));
}

export async function getRevision(db: Db, drawingId: string, letter: string) {
	const [row] = await db
		.select()
		.from(revisions)
		.where(and(eq(revisions.drawingId, drawingId), eq(revisions.letter, letter)));
	return row ?? null;
}

export async function getRevisionById(db: Db, id: string) {
	const [row] = await db.select().from(revisions).where(eq(revisions.id, id));
	return row ?? null;
}

export async function latestRevision(db: Db, drawingId: string) {
	const [row] = await db
		.select()
		.from(revisions)
		.where(eq(revisions.drawingId, drawingId))
		.orderBy(desc(revisions.createdAt))
		.limit(1);
	return row ?? null;
}

export class RevisionLetterTaken extends Error {}

export async function insertRevision(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	values: Omit<typeof revisions.$inferInsert, 'drawingId' | 'uploadedBy' | 'settings'>
) {
	return db.transaction(async (tx) => {
		const [row] = await tx
			.insert(revisions)
			.values({
				...values,
				drawingId: drawing.id,
				uploadedBy: actor.id,
				settings: settingsOf(drawing)
			})
			.onConflictDoNothing()
			.returning();
		if (!row) throw new RevisionLetterTaken(`Revision ${values.letter} already exists`);
		await recordActivity(tx, {
			teamId: drawing.teamId,
			actor,
			entity: 'revision',
			entityId: row.id,
			drawingId: drawing.id,
			action: 'upload',
			summary: `uploaded revision ${row.letter} of ${drawing.number} (${row.pages} sheet${row.pages === 1 ? '' : 's'})`,
			after: publicRevision(row)
		});
		// The drawing's own rules read the settings it starts with.
		await recheckRevision(tx, actor, row.id, 'full');
		return row;
	});
}

export function publicDrawing(row: DrawingRow) {
	return {
		number: row.number,
		title: row.title,
		partName: row.partName,
		material: row.material,
		units: row.units,
		standard: row.standard,
		generalTolerance: row.generalTolerance ?? null,
		notes: row.notes,
		version: row.version
	};
}

/** The copy a new revision takes of its drawing's settings. */
export function settingsOf(drawing: DrawingRow): RevisionSettings {
	return {
		units: drawing.units,
		standard: drawing.standard,
		generalTolerance: drawing.generalTolerance ?? null
	};
}

export function publicRevision(row: RevisionRow) {
	return {
		letter: row.letter,
		reason: row.reason,
		state: row.state,
		settings: row.settings,
		pages: row.pages,
		sheets: row.sheets,
		sha256: row.sha256,
		size: row.size,
		uploadedBy: row.uploadedBy,
		createdAt: row.createdAt,
		approvedBy: row.approvedBy ?? null,
		approvedAt: row.approvedAt ?? null,
		releasedBy: row.releasedBy ?? null,
		releasedAt: row.releasedAt ?? null,
		version: row.version
	};
}

export type RevisionChanges = { reason?: string; settings?: Partial<RevisionSettings> };

/**
 * Corrects the reason and the revision's own settings. Settings freeze with the revision
 * (`frozen`); a stale version gives the current row (`stale`).
 */
export async function updateRevision(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	version: number,
	changes: RevisionChanges
) {
	return db.transaction(async (tx) => {
		const [locked] = await tx
			.select()
			.from(revisions)
			.where(eq(revisions.id, revision.id))
			.for('update');
		if (locked.version !== version) return { ok: false as const, code: 'stale', current: locked };
		if (changes.settings && isFrozen(locked.state)) {
			return { ok: false as const, code: 'frozen', current: locked };
		}
		const settings = changes.settings ? { ...locked.settings, ...changes.settings } : undefined;
		const [row] = await tx
			.update(revisions)
			.set({
				...(changes.reason !== undefined ? { reason: changes.reason } : {}),
				...(settings ? { settings } : {}),
				version: sql`${revisions.version} + 1`
			})
			.where(eq(revisions.id, revision.id))
			.returning();
		const what = [
			changes.reason !== undefined ? 'the reason' : null,
			settings ? 'the settings' : null
		].filter(Boolean);
		await recordActivity(tx, {
			teamId: drawing.teamId,
			actor,
			entity: 'revision',
			entityId: row.id,
			drawingId: drawing.id,
			action: 'update',
			summary: `changed ${what.join(' and ') || 'nothing'} of revision ${row.letter} of ${drawing.number}`,
			before: { reason: locked.reason, settings: locked.settings },
			after: { reason: row.reason, settings: row.settings }
		});
		// Every rule may read the settings: judge the whole revision again.
		if (settings) await recheckRevision(tx, actor, row.id, 'full');
		await appendEvent(tx, {
			revisionId: row.id,
			type: 'revision',
			action: 'update',
			id: row.id,
			version: row.version
		});
		return { ok: true as const, revision: row };
	});
}
