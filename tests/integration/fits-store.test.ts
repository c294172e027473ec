import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import { activity, revisions, type DrawingRow } from '../../src/lib/server/db/schema';
import type { Actor } from '../../src/lib/server/db/queries/activity';
import { addFeature, removeFeature, type FeaturePlace } from '../../src/lib/server/features';
import {
	addFit,
	editFit,
	fitsOf,
	removeFit,
	visibleFitOf,
	type FitPlace
} from '../../src/lib/server/fits';
import { featureInput } from '../../src/lib/schemas/features';
import { fitCreate, fitPatch, fitResponse } from '../../src/lib/schemas/fits';
import type { FeatureJson } from '../../src/lib/features';
import { getFeature } from '../../src/lib/server/db/queries/features';
import { listFits } from '../../src/lib/server/db/queries/fits';
import { freshDatabase, teamWithTwoDrawings } from './harness';

let database: Database;
let actor: Actor;
let bushing: DrawingRow;
let shaftDrawing: DrawingRow;
let newRevision: (drawing: DrawingRow) => Promise<FeaturePlace & FitPlace>;

async function feature(place: FeaturePlace, data: Record<string, unknown>): Promise<FeatureJson> {
	const outcome = await addFeature(database.db, actor, place, featureInput.parse(data));
	if (!outcome.ok) throw new Error(outcome.message);
	return outcome.feature;
}

/** The bushing's Ø12 H7 bore (ISO 8015) and the shaft drawing's Ø12 g6 journal (ASME). */
async function pair() {
	const hole = await newRevision(bushing);
	const other = await newRevision(shaftDrawing);
	const bore = await feature(hole, { kind: 'bore', label: 'Bore', callout: 'Ø12 H7' });
	const journal = await feature(other, { kind: 'shaft', label: 'Journal', callout: 'Ø12 g6' });
	return { hole, other, bore, journal };
}

beforeAll(async () => {
	database = await freshDatabase();
	({ actor, bushing, shaft: shaftDrawing, newRevision } = await teamWithTwoDrawings(database.db));
});
afterAll(() => database?.close());

describe('fits across drawings', () => {
	it('compute each member under its own revision: Ø12 H7 / g6 gives 0.006 / 0.035', async () => {
		const { hole, other, bore, journal } = await pair();
		const outcome = await addFit(
			database.db,
			actor,
			hole,
			fitCreate.parse({ holeFeatureId: bore.id, shaftFeatureId: journal.id, intent: 'running' })
		);
		expect(outcome.ok).toBe(true);
		if (!outcome.ok) return;
		// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the computed values are read loosely
		const fit = outcome.fit as Record<string, any>;
		// ISO 286-2:2010, tables: H7 over 10 to 18 mm is 0/+0.018, g6 is -0.006/-0.017.
		expect(fit.minClearance).toBe('0.006');
		expect(fit.maxClearance).toBe('0.035');
		expect(fit.classification).toBe('clearance');
		expect(fit.hole.upper).toBe('12.018');
		expect(fit.shaft.lower).toBe('11.983');
		// ISO 8015 (independency) on the bushing: no envelope; ASME Y14.5 Rule #1 on the journal.
		expect(fit.hole.envelope.applies).toBe(false);
		expect(fit.shaft.envelope.applies).toBe(true);
		expect(fit.verdict).toBeTruthy();
		expect(Array.isArray(fit.checks)).toBe(true);
		expect(fit.owned).toBe(true);
		// The OpenAPI document's response schema describes the answer.
		expect(fitResponse.safeParse(fit).error).toBeUndefined();
		expect(fit.members.shaft).toMatchObject({ drawing: 'KF-1003', balloon: journal.balloon });

		// Listed on both revisions; read-only on the journal's.
		const onHole = await fitsOf(database.db, hole);
		const onShaft = await fitsOf(database.db, other);
		expect(onHole.map((f) => f.id)).toEqual([fit.id]);
		expect(onShaft.map((f) => f.id)).toEqual([fit.id]);
		expect(onShaft[0].owned).toBe(false);
		expect(onShaft[0].minClearance).toBe('0.006');
		const rows = await database.db.select().from(activity).where(eq(activity.entityId, fit.id));
		expect(rows.map((r) => r.action)).toEqual(['create']);
	});

	it('are changed only through the hole revision, with the version, until it is frozen', async () => {
		const { hole, other, bore, journal } = await pair();
		const made = await addFit(
			database.db,
			actor,
			hole,
			fitCreate.parse({ holeFeatureId: bore.id, shaftFeatureId: journal.id })
		);
		if (!made.ok) throw new Error(made.message);
		const [row] = await listFits(database.db, hole.revision.id);
		// Left out, the intent is what the limits make of it.
		expect(made.fit.intent).toBe('running');

		const elsewhere = await editFit(
			database.db,
			actor,
			other,
			row,
			fitPatch.parse({ version: 1, requiredMinClearance: '0.010' })
		);
		expect(elsewhere).toMatchObject({ ok: false, status: 409, code: 'not_owner' });
		expect((elsewhere as { message: string }).message).toContain('KF-1002');

		const edited = await editFit(
			database.db,
			actor,
			hole,
			row,
			fitPatch.parse({ version: 1, requiredMinClearance: '0.010' })
		);
		expect(edited.ok).toBe(true);
		if (!edited.ok) return;
		expect(edited.fit.version).toBe(2);
		expect(edited.fit.verdict).not.toBe(made.fit.verdict);
		const stale = await editFit(
			database.db,
			actor,
			hole,
			row,
			fitPatch.parse({ version: 1, sharedDatumFrame: true })
		);
		expect(stale).toMatchObject({ ok: false, code: 'stale', current: { version: 2 } });

		// A feature a fit uses is not deleted.
		const journalRow = await getFeature(database.db, other.revision.id, journal.id);
		const inUse = await removeFeature(database.db, actor, other, journalRow!, journal.version);
		expect(inUse).toMatchObject({ ok: false, status: 409, code: 'in_use' });

		await database.db
			.update(revisions)
			.set({ state: 'approved' })
			.where(eq(revisions.id, hole.revision.id));
		const frozen = await removeFit(database.db, actor, hole, { ...row, version: 2 }, 2);
		expect(frozen).toMatchObject({ ok: false, status: 409, code: 'frozen' });
		await database.db
			.update(revisions)
			.set({ state: 'draft' })
			.where(eq(revisions.id, hole.revision.id));
		expect(await removeFit(database.db, actor, hole, { ...row, version: 2 }, 2)).toEqual({
			ok: true
		});
		expect(await fitsOf(database.db, other)).toEqual([]);
	});

	it('are shown to someone who reads released revisions only when every member is released', async () => {
		const { hole, other, bore, journal } = await pair();
		const made = await addFit(
			database.db,
			actor,
			hole,
			fitCreate.parse({ holeFeatureId: bore.id, shaftFeatureId: journal.id })
		);
		if (!made.ok) throw new Error(made.message);
		const release = (id: string) =>
			database.db.update(revisions).set({ state: 'released' }).where(eq(revisions.id, id));
		await release(hole.revision.id);
		const [row] = await listFits(database.db, hole.revision.id);
		// Supplier quality on the released bushing: the journal's revision is still a draft.
		const quality = { ...hole, releasedOnly: true };
		expect(await fitsOf(database.db, quality)).toEqual([]);
		expect(await visibleFitOf(database.db, quality, row)).toBeNull();
		expect((await fitsOf(database.db, hole)).map((f) => f.id)).toEqual([made.fit.id]);
		await release(other.revision.id);
		expect((await fitsOf(database.db, quality)).map((f) => f.id)).toEqual([made.fit.id]);
		expect((await visibleFitOf(database.db, quality, row))?.id).toBe(made.fit.id);
	});

	it('refuse a hole of another revision and a shaft of another team, storing nothing', async () => {
		const { hole, other, bore, journal } = await pair();
		const wrongRevision = await addFit(
			database.db,
			actor,
			other,
			fitCreate.parse({ holeFeatureId: bore.id, shaftFeatureId: journal.id })
		);
		expect(wrongRevision).toMatchObject({ ok: false, status: 400, field: 'holeFeatureId' });
		const otherTeam = await addFit(
			database.db,
			actor,
			{ ...hole, team: { ...hole.team, id: crypto.randomUUID() } },
			fitCreate.parse({ holeFeatureId: bore.id, shaftFeatureId: journal.id })
		);
		expect(otherTeam).toMatchObject({ ok: false, status: 400 });
		expect(await fitsOf(database.db, hole)).toEqual([]);
	});

	it('take a bought fastener as the other member', async () => {
		const place = await newRevision(bushing);
		const clearance = await feature(place, {
			kind: 'hole',
			label: 'Clearance hole',
			callout: '4X Ø6.6 +0.2/0'
		});
		const outcome = await addFit(
			database.db,
			actor,
			place,
			fitCreate.parse({
				holeFeatureId: clearance.id,
				fastener: { callout: 'M6', label: 'ISO 4762 screw' },
				intent: 'floating-fastener'
			})
		);
		expect(outcome.ok).toBe(true);
		if (!outcome.ok) return;
		expect(outcome.fit.fastener).toMatchObject({ callout: 'M6', label: 'ISO 4762 screw' });
		expect(outcome.fit.members.shaft).toBeNull();
		expect(fitResponse.safeParse(outcome.fit).error).toBeUndefined();
		expect(outcome.fit.minClearance).toBeTruthy();
	});
});
