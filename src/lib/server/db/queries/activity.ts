import { and, desc, eq, lt } from 'drizzle-orm';
import type { Db } from '../connect';
import { activity } from '../schema';

/** Who does something: the signed-in user as every change records them. */
export type Actor = { id: string; name: string | null; email: string };

export interface ActivityEntry {
	teamId: string | null;
	actor: { id: string; name: string | null; email?: string } | null;
	entity: string;
	entityId: string;
	action: string;
	summary: string;
	before?: unknown;
	after?: unknown;
	drawingId?: string | null;
}

/**
 * The one way anything is written to the trail; call it inside the change's transaction. A list
 * of entries (a bulk change: an import) goes in with as few statements as it takes.
 */
export async function recordActivity(db: Db, entry: ActivityEntry | ActivityEntry[]) {
	const entries = Array.isArray(entry) ? entry : [entry];
	for (const chunk of chunks(entries, 1000)) {
		await db.insert(activity).values(
			chunk.map((e) => ({
				teamId: e.teamId,
				actorId: e.actor?.id ?? null,
				actorName: e.actor ? (e.actor.name ?? e.actor.email ?? null) : null,
				entity: e.entity,
				entityId: e.entityId,
				action: e.action,
				summary: e.summary,
				before: e.before ?? null,
				after: e.after ?? null,
				drawingId: e.drawingId ?? null
			}))
		);
	}
}

/** `list` cut into runs of at most `size` (a statement's parameters are limited). */
export function chunks<T>(list: T[], size: number): T[][] {
	const runs: T[][] = [];
	for (let i = 0; i < list.length; i += size) runs.push(list.slice(i, i + size));
	return runs;
}

export async function listTeamActivity(
	db: Db,
	teamId: string,
	options: { before?: number; limit?: number } = {}
) {
	const limit = Math.min(options.limit ?? 100, 500);
	return db
		.select()
		.from(activity)
		.where(
			and(eq(activity.teamId, teamId), options.before ? lt(activity.id, options.before) : undefined)
		)
		.orderBy(desc(activity.id))
		.limit(limit);
}
