import { and, eq, inArray, or } from 'drizzle-orm';
import type { Db } from '../connect';
import {
	drawings,
	features,
	fits,
	revisions,
	type DrawingRow,
	type FeatureRow,
	type FitRow,
	type RevisionRow
} from '../schema';
import type { Actor } from './activity';
import { StaleWrite, writeOnRevision } from './revision-writes';
import type { RecheckScope } from './rule-findings';

export type FitValues = Omit<
	typeof fits.$inferInsert,
	'id' | 'teamId' | 'revisionId' | 'version' | 'createdBy' | 'createdAt' | 'updatedAt'
>;

export class StaleFit extends StaleWrite<FitRow> {
	/** `current` is null when the fit was deleted meanwhile. */
	constructor(current: FitRow | null) {
		super(current, 'fit');
	}
}

/** A feature with the revision and drawing it sits on. */
export interface PlacedFeature {
	feature: FeatureRow;
	revision: RevisionRow;
	drawing: DrawingRow;
}

/** Fits owned by the revision (its holes) and fits whose shaft sits on it. */
export async function listFits(db: Db, revisionId: string) {
	return db
		.select()
		.from(fits)
		.where(or(eq(fits.revisionId, revisionId), eq(fits.shaftRevisionId, revisionId)))
		.orderBy(fits.createdAt, fits.id);
}

/** A fit listed on the revision (owned by it or using one of its features as the shaft). */
export async function getFit(db: Db, revisionId: string, id: string) {
	const [row] = await db
		.select()
		.from(fits)
		.where(
			and(
				eq(fits.id, id),
				or(eq(fits.revisionId, revisionId), eq(fits.shaftRevisionId, revisionId))
			)
		);
	return row ?? null;
}

/** The team's features by id with their revisions and drawings; other teams' ids are left out. */
export async function placedFeatures(db: Db, teamId: string, ids: string[]) {
	const unique = [...new Set(ids)];
	if (unique.length === 0) return new Map<string, PlacedFeature>();
	const rows = await db
		.select({ feature: features, revision: revisions, drawing: drawings })
		.from(features)
		.innerJoin(revisions, eq(revisions.id, features.revisionId))
		.innerJoin(drawings, eq(drawings.id, features.drawingId))
		.where(and(inArray(features.id, unique), eq(drawings.teamId, teamId)));
	return new Map(rows.map((r) => [r.feature.id, r]));
}

/** The stored record as the trail keeps it (before and after), without computed values. */
export function storedFit(row: FitRow) {
	return {
		id: row.id,
		revisionId: row.revisionId,
		holeFeatureId: row.holeFeatureId,
		shaftFeatureId: row.shaftFeatureId ?? null,
		fastener: row.fastener ?? null,
		fixedHoleFeatureId: row.fixedHoleFeatureId ?? null,
		intent: row.intent,
		requiredMinClearance: row.requiredMinClearance ?? null,
		requiredMaxClearance: row.requiredMaxClearance ?? null,
		sharedDatumFrame: row.sharedDatumFrame,
		temperature: row.temperature ?? null,
		version: row.version
	};
}

/** What the rulebook re-checks after a fit changes: the fit and its members, before and after. */
function recheckOf(...rows: FitRow[]): RecheckScope {
	const featureIds = rows.flatMap((r) =>
		[r.holeFeatureId, r.shaftFeatureId, r.fixedHoleFeatureId].filter((id): id is string => !!id)
	);
	return { fitIds: [rows[0].id], featureIds: [...new Set(featureIds)] };
}

const where = (revision: RevisionRow, drawing: DrawingRow) =>
	`revision ${revision.letter} of ${drawing.number}`;

/** Adds a fit to the revision of its hole. */
export async function createFit(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	values: FitValues,
	summary: string
) {
	return writeOnRevision(
		db,
		{ actor, drawing, revision },
		{
			entity: 'fit',
			listedOn: (row: FitRow) => [row.shaftRevisionId],
			write: (tx) =>
				tx
					.insert(fits)
					.values({
						...values,
						teamId: drawing.teamId,
						revisionId: revision.id,
						createdBy: actor.id
					})
					.returning(),
			recheck: (row) => recheckOf(row),
			record: (row) => ({
				action: 'create',
				summary: `added the fit ${summary} on ${where(revision, drawing)}`,
				after: storedFit(row)
			})
		}
	);
}

/** Applies an edit made against `version`; a stale one throws with the current fit. */
export async function updateFit(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	fit: FitRow,
	version: number,
	changes: Partial<FitValues>,
	summary: string
) {
	return writeOnRevision(
		db,
		{ actor, drawing, revision },
		{
			entity: 'fit',
			listedOn: (row: FitRow) => [row.shaftRevisionId],
			write: (tx) =>
				tx
					.update(fits)
					.set({ ...changes, version: fit.version + 1, updatedAt: new Date() })
					.where(and(eq(fits.id, fit.id), eq(fits.version, version)))
					.returning(),
			stale: async (tx) => new StaleFit(await currentFit(tx, fit.id)),
			recheck: (row) => recheckOf(row, fit),
			record: (row) => ({
				action: 'update',
				summary: `edited the fit ${summary} on ${where(revision, drawing)}`,
				before: storedFit(fit),
				after: storedFit(row)
			})
		}
	);
}

export async function deleteFit(
	db: Db,
	actor: Actor,
	drawing: DrawingRow,
	revision: RevisionRow,
	fit: FitRow,
	version: number,
	summary: string
) {
	return writeOnRevision(
		db,
		{ actor, drawing, revision },
		{
			entity: 'fit',
			listedOn: (row: FitRow) => [row.shaftRevisionId],
			write: (tx) =>
				tx
					.delete(fits)
					.where(and(eq(fits.id, fit.id), eq(fits.version, version)))
					.returning(),
			stale: async (tx) => new StaleFit(await currentFit(tx, fit.id)),
			recheck: (row) => recheckOf(row),
			record: (row) => ({
				action: 'delete',
				summary: `deleted the fit ${summary} from ${where(revision, drawing)}`,
				before: storedFit(row)
			})
		}
	);
}

async function currentFit(tx: Db, id: string) {
	const [current] = await tx.select().from(fits).where(eq(fits.id, id));
	return current ?? null;
}
