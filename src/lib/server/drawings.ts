import { error } from '@sveltejs/kit';
import { can, type Capability } from './capabilities';
import { db } from './db';
import { isUuid } from './api-input';
import {
	getDrawing,
	getRevision,
	isVisibleToSuppliers,
	listRevisions
} from './db/queries/drawings';
import { getFeature } from './db/queries/features';
import { getFinding } from './db/queries/findings';
import { getFit } from './db/queries/fits';
import { requireMember } from './guards';

export function notFound(): never {
	error(404, { message: 'Not found', code: 'not_found' });
}

/**
 * A drawing the asker may see with `capability`. Supplier quality sees a drawing only once a
 * revision of it is released; to everyone else an unknown number is simply 404.
 */
export async function requireDrawing(teamSlug: string, number: string, capability: Capability) {
	const access = await requireMember(teamSlug, capability);
	const drawing = await getDrawing(db, access.team.id, number);
	if (!drawing) notFound();
	const releasedOnly = !can(access.membership.role, 'viewUnreleased');
	if (releasedOnly && (await listRevisions(db, drawing.id, { releasedOnly })).length === 0) {
		notFound();
	}
	return { ...access, drawing, releasedOnly };
}

export async function requireRevision(
	teamSlug: string,
	number: string,
	letter: string,
	capability: Capability
) {
	const access = await requireDrawing(teamSlug, number, capability);
	const revision = await getRevision(db, access.drawing.id, letter);
	if (!revision) notFound();
	if (access.releasedOnly && !isVisibleToSuppliers(revision.state)) notFound();
	return { ...access, revision };
}

/** A feature of a revision the asker may see with `capability`; other ids answer 404. */
export async function requireFeature(
	params: { team: string; number: string; letter: string; id: string },
	capability: Capability
) {
	const place = await requireRevision(params.team, params.number, params.letter, capability);
	const feature = isUuid(params.id) ? await getFeature(db, place.revision.id, params.id) : null;
	if (!feature) notFound();
	return { place, feature };
}

/** A fit listed on a revision the asker may see with `capability` (owned or using its feature). */
export async function requireFit(
	params: { team: string; number: string; letter: string; id: string },
	capability: Capability
) {
	const place = await requireRevision(params.team, params.number, params.letter, capability);
	const fit = isUuid(params.id) ? await getFit(db, place.revision.id, params.id) : null;
	if (!fit) notFound();
	return { place, fit };
}

/** A finding of a revision the asker may see with `capability`; other ids answer 404. */
export async function requireFinding(
	params: { team: string; number: string; letter: string; id: string },
	capability: Capability
) {
	const place = await requireRevision(params.team, params.number, params.letter, capability);
	const finding = isUuid(params.id) ? await getFinding(db, place.revision.id, params.id) : null;
	if (!finding) notFound();
	return { place, finding };
}

/**
 * A revision to export: released ones for everyone with `exportReleased` (supplier quality sees
 * no others), every state for `exportUnreleased`.
 */
export async function requireExport(params: { team: string; number: string; letter: string }) {
	const place = await requireRevision(params.team, params.number, params.letter, 'exportReleased');
	const released = isVisibleToSuppliers(place.revision.state);
	if (!released && !can(place.membership.role, 'exportUnreleased')) {
		error(403, {
			message: 'Your role exports released revisions only',
			code: 'forbidden'
		});
	}
	return place;
}
