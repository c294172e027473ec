import { and, asc, desc, eq, ilike, inArray, or, sql } from 'drizzle-orm';
import type { Db } from '../connect';
import {
	drawings,
	features,
	fits,
	revisions,
	type DrawingRow,
	type FeatureRow,
	type RevisionRow
} from '../schema';
import { chunks, recordActivity, type Actor, type ActivityEntry } from './activity';
import { appendEvents } from './revision-events';
import { lockOpenRevision, StaleWrite, writeOnRevision } from './revision-writes';
import { recheckRevision, type RecheckScope } from './rule-findings';
import { visibleToSuppliers } from './drawings';

export type FeatureValues = Omit<
	typeof features.$inferInsert,
	| 'id'
	| 'revisionId'
	| 'drawingId'
	| 'balloon'
	| 'version'
	| 'createdBy'
	| 'createdAt'
	| 'updatedAt'
>;

export { RevisionFrozen, lockOpenRevision } from './revision-writes';

export class StaleFeature extends StaleWrite<FeatureRow> {
	/** `current` is null when the feature was deleted meanwhile. */
	constructor(current: FeatureRow | null) {
		super(current, 'feature');
	}
}

/** A feature that a fit uses is not deleted: the fit would lose a member (delete the fit first). */
export class FeatureInUse extends Error {
	constructor(readonly fitIds: string[]) {
		super(
			`This feature is a member of ${fitIds.length === 1 ? 'a fit' : `${fitIds.length} fits`}: delete ${fitIds.length === 1 ? 'that fit' : 'those fits'} first`
		);
	}
}

export async function listFeatures(db: Db, revisionId: string) {
	return db
		.select()
		.from(features)
		.where(eq(features.revisionId, revisionId))
		.orderBy(asc(features.balloon));
}

export async function getFeature(db: Db, revisionId: string, id: string) {
	const [row] = await db
		.select()
		.from(features)
		.where(and(eq(features.revisionId, revisionId), eq(features.id, id)));
	return row ?? null;
}

/** The stored record as the trail keeps it (before and after), without computed values. */
export function storedFeature(row: FeatureRow) {
	return {
		id: row.id,
		balloon: row.balloon,
		label: row.label,
		kind: row.kind,
		internal: row.internal,
		boughtOut: row.boughtOut,
		datumFeature: row.datumFeature ?? null,
		carried: row.carried ?? null,
		callout: row.callout,
		quantity: row.quantity,
		controls: row.controls,
		overrides: row.overrides,
		location: row.location ?? null,
		notes: row.notes,
		version: row.version
	};
}

const name = (row: FeatureRow) => `feature ${row.balloon}${row.label ? ` (${row.label})` : ''}`;

/** Adds a feature with the drawing's next balloon number: counted, never reused. */
export async function createFeature(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	values: FeatureValues
) {
	const [row] = await createFeatures(db, actor, drawing, revision, [values]);
	return row;
}

/** Adds features in one transaction (all or none), balloons in the given order. */
export async function createFeatures(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	list: FeatureValues[]
) {
	return db.transaction(async (tx) => {
		await lockOpenRevision(tx, revision);
		const [counter] = await tx
			.update(drawings)
			.set({ nextBalloon: sql`${drawings.nextBalloon} + ${list.length}` })
			.where(eq(drawings.id, drawing.id))
			.returning({ next: drawings.nextBalloon });
		const first = counter.next - list.length;
		const rows: FeatureRow[] = [];
		// In runs, not a statement per feature: an import of thousands stays quick.
		for (const run of chunks(
			list.map((values, i) => ({ values, balloon: first + i })),
			400
		)) {
			const written = await tx
				.insert(features)
				.values(
					run.map(({ values, balloon }) => ({
						...values,
						revisionId: revision.id,
						drawingId: drawing.id,
						balloon,
						createdBy: actor.id
					}))
				)
				.returning();
			written.sort((a, b) => a.balloon - b.balloon);
			await recordActivity(
				tx,
				written.map((row): ActivityEntry => ({
					teamId: drawing.teamId,
					actor,
					entity: 'feature',
					entityId: row.id,
					drawingId: drawing.id,
					action: 'create',
					summary: `added ${name(row)} ${row.callout} on revision ${revision.letter} of ${drawing.number}`,
					after: storedFeature(row)
				}))
			);
			rows.push(...written);
		}
		await recheckRevision(
			tx,
			actor,
			revision.id,
			rows.some((r) => r.datumFeature) ? 'full' : { featureIds: rows.map((r) => r.id) }
		);
		await appendEvents(
			tx,
			revision.id,
			rows.map((row) => ({ type: 'feature', action: 'create', id: row.id, version: row.version })),
			// Locked at the start of this transaction (lockOpenRevision).
			{ lock: false }
		);
		return rows;
	});
}

/**
 * What the rulebook re-checks after a feature changes: the feature (and so its fits), or the
 * whole revision when a datum letter it defines came or went (GEO-04 reads every feature).
 */
function recheckOf(row: FeatureRow, datumChanged: boolean): RecheckScope {
	return datumChanged ? 'full' : { featureIds: [row.id] };
}

/** Applies an edit made against `version`; a stale one throws with the current feature. */
export async function updateFeature(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	feature: FeatureRow,
	version: number,
	changes: Partial<FeatureValues>
) {
	return writeOnRevision(
		db,
		{ actor, drawing, revision },
		{
			entity: 'feature',
			write: (tx) =>
				tx
					.update(features)
					.set({ ...changes, version: sql`${features.version} + 1`, updatedAt: new Date() })
					.where(and(eq(features.id, feature.id), eq(features.version, version)))
					.returning(),
			stale: async (tx) => new StaleFeature(await currentFeature(tx, feature.id)),
			recheck: (row) => recheckOf(row, feature.datumFeature !== row.datumFeature),
			record: (row) => ({
				action: 'update',
				summary: `edited ${name(row)} on revision ${revision.letter} of ${drawing.number}`,
				before: storedFeature(feature),
				after: storedFeature(row)
			})
		}
	);
}

export async function deleteFeature(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	feature: FeatureRow,
	version: number
) {
	return writeOnRevision(
		db,
		{ actor, drawing, revision },
		{
			entity: 'feature',
			check: async (tx) => {
				const using = await tx
					.select({ id: fits.id })
					.from(fits)
					.where(
						or(
							eq(fits.holeFeatureId, feature.id),
							eq(fits.shaftFeatureId, feature.id),
							eq(fits.fixedHoleFeatureId, feature.id)
						)
					);
				if (using.length > 0) throw new FeatureInUse(using.map((f) => f.id));
			},
			write: (tx) =>
				tx
					.delete(features)
					.where(and(eq(features.id, feature.id), eq(features.version, version)))
					.returning(),
			stale: async (tx) => new StaleFeature(await currentFeature(tx, feature.id)),
			recheck: (row) => recheckOf(row, !!row.datumFeature),
			record: (row) => ({
				action: 'delete',
				summary: `deleted ${name(row)} from revision ${revision.letter} of ${drawing.number}`,
				before: storedFeature(row)
			})
		}
	);
}

async function currentFeature(tx: Db, id: string) {
	const [current] = await tx.select().from(features).where(eq(features.id, id));
	return current ?? null;
}

const likePattern = (word: string) => `%${word.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * Features of the team's drawings that match every word of `q` in the drawing number, the
 * label or the callout, or by balloon (`12`, `#12`); newest revision first per drawing.
 * `releasedOnly` keeps to revisions supplier quality may read.
 */
export async function searchFeatures(
	db: Db,
	teamId: string,
	search: { q: string; internal?: boolean; limit: number; releasedOnly: boolean }
) {
	const words = search.q.split(/\s+/).filter(Boolean).slice(0, 6);
	const matches = words.map((word) => {
		const like = likePattern(word);
		const balloon = /^#?\d{1,6}$/.test(word) ? Number(word.replace('#', '')) : null;
		return or(
			ilike(drawings.number, like),
			ilike(features.label, like),
			ilike(features.callout, like),
			balloon === null ? undefined : eq(features.balloon, balloon)
		);
	});
	return db
		.select({
			featureId: features.id,
			drawing: drawings.number,
			title: drawings.title,
			letter: revisions.letter,
			state: revisions.state,
			balloon: features.balloon,
			label: features.label,
			kind: features.kind,
			internal: features.internal,
			callout: features.callout,
			quantity: features.quantity
		})
		.from(features)
		.innerJoin(revisions, eq(revisions.id, features.revisionId))
		.innerJoin(drawings, eq(drawings.id, features.drawingId))
		.where(
			and(
				eq(drawings.teamId, teamId),
				search.releasedOnly ? inArray(revisions.state, visibleToSuppliers) : undefined,
				search.internal === undefined ? undefined : eq(features.internal, search.internal),
				...matches
			)
		)
		.orderBy(asc(drawings.number), desc(revisions.createdAt), asc(features.balloon))
		.limit(search.limit);
}
