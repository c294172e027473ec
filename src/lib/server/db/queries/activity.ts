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

/** The one way anything is written to the trail; call it inside the change's transaction. */
export async function recordActivity(db: Db, entry: ActivityEntry) {
	await db.insert(activity).values({
		teamId: entry.teamId,
		actorId: entry.actor?.id ?? null,
		actorName: entry.actor ? (entry.actor.name ?? entry.actor.email ?? null) : null,
		entity: entry.entity,
		entityId: entry.entityId,
		action: entry.action,
		summary: entry.summary,
		before: entry.before ?? null,
		after: entry.after ?? null,
		drawingId: entry.drawingId ?? null
	});
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
