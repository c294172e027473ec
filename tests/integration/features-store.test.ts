import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import { activity, revisions, type DrawingRow } from '../../src/lib/server/db/schema';
import {
	getRevision,
	updateDrawing,
	updateRevision
} from '../../src/lib/server/db/queries/drawings';
import type { Actor } from '../../src/lib/server/db/queries/activity';
import {
	addFeature,
	editFeature,
	featuresOf,
	removeFeature,
	type FeaturePlace
} from '../../src/lib/server/features';
import { featureInput, featurePatch } from '../../src/lib/schemas/features';
import { getFeature } from '../../src/lib/server/db/queries/features';
import { freshDatabase, teamWithTwoDrawings } from './harness';

let database: Database;
let actor: Actor;
let drawing: DrawingRow;
let setup: Awaited<ReturnType<typeof teamWithTwoDrawings>>;

/** A revision of the bushing (as it is now) stored without a file, on two sheets. */
const newRevision = (): Promise<FeaturePlace> => setup.newRevision(drawing, 2);

const input = (data: Record<string, unknown>) => featureInput.parse(data);
const patch = (data: Record<string, unknown>) => featurePatch.parse(data);

beforeAll(async () => {
	database = await freshDatabase();
	setup = await teamWithTwoDrawings(database.db);
	({ actor, bushing: drawing } = setup);
});
afterAll(() => database?.close());

describe('revision settings', () => {
	it('are copied from the drawing at upload and stay when the drawing changes', async () => {
		const { revision } = await newRevision();
		expect(revision.settings).toEqual({
			units: 'mm',
			standard: 'iso-8015',
			generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' }
		});
		drawing = await updateDrawing(database.db, actor, drawing, drawing.version, {
			standard: 'asme-y14.5-2018',
			generalTolerance: null
		});
		const again = await getRevision(database.db, drawing.id, revision.letter);
		expect(again!.settings.standard).toBe('iso-8015');
		expect(again!.settings.generalTolerance).toEqual({
			kind: 'iso2768',
			linear: 'm',
			geometric: 'K'
		});
		// The next revision takes the drawing's new defaults.
		const next = await newRevision();
		expect(next.revision.settings).toEqual({
			units: 'mm',
			standard: 'asme-y14.5-2018',
			generalTolerance: null
		});
		drawing = await updateDrawing(database.db, actor, drawing, drawing.version, {
			standard: 'iso-8015'
		});
	});

	it('are edited on the revision until it is frozen', async () => {
		const { revision } = await newRevision();
		const edited = await updateRevision(database.db, actor, drawing, revision, revision.version, {
			settings: { standard: 'asme-y14.5-2009' }
		});
		expect(edited.ok).toBe(true);
		if (!edited.ok) return;
		expect(edited.revision.settings.standard).toBe('asme-y14.5-2009');
		expect(edited.revision.settings.units).toBe('mm');
		const stale = await updateRevision(database.db, actor, drawing, revision, revision.version, {
			reason: 'late'
		});
		expect(stale).toMatchObject({ ok: false, code: 'stale' });

		await database.db
			.update(revisions)
			.set({ state: 'approved' })
			.where(eq(revisions.id, revision.id));
		const frozen = await updateRevision(
			database.db,
			actor,
			drawing,
			revision,
			edited.revision.version,
			{ settings: { standard: 'iso-8015' } }
		);
		expect(frozen).toMatchObject({ ok: false, code: 'frozen' });
		const kept = await getRevision(database.db, drawing.id, revision.letter);
		expect(kept!.settings.standard).toBe('asme-y14.5-2009');
	});
});

describe('features', () => {
	it('compute limits under the revision settings, with balloons per drawing never reused', async () => {
		const place = await newRevision();
		const created = await addFeature(
			database.db,
			actor,
			place,
			input({
				kind: 'hole',
				label: 'Bore',
				callout: 'Ø12 H7',
				location: { sheet: 1, x: 0.4, y: 0.3 }
			})
		);
		expect(created.ok).toBe(true);
		if (!created.ok) return;
		const first = created.feature;
		// ISO 286-2:2010, table 2 (H, over 10 to 18 mm): lower 0; table 1 IT7 = 18 µm.
		expect(first).toMatchObject({
			label: 'Bore',
			internal: true,
			quantity: 1,
			upper: '12.018',
			lower: '12.000',
			tolerance: '0.018',
			mmc: '12.000',
			lmc: '12.018',
			location: { sheet: 1, x: 0.4, y: 0.3 },
			version: 1,
			problem: null
		});
		// ISO 8015: independency by default, no envelope without Ⓔ.
		expect(first.envelope?.applies).toBe(false);

		const pins = await addFeature(
			database.db,
			actor,
			place,
			input({ kind: 'pin', callout: '4X Ø6 g6' })
		);
		expect(pins).toMatchObject({ ok: true, feature: { quantity: 4, internal: false } });
		if (!pins.ok) return;
		const removed = await removeFeature(
			database.db,
			actor,
			place,
			await row(place, pins.feature.id),
			1
		);
		expect(removed.ok).toBe(true);
		const third = await addFeature(
			database.db,
			actor,
			place,
			input({ kind: 'width', callout: '20 ±0.1' })
		);
		expect(third.ok && third.feature.balloon).toBe(first.balloon + 2);
		// A new revision of the same drawing goes on counting.
		const other = await newRevision();
		const fourth = await addFeature(
			database.db,
			actor,
			other,
			input({ kind: 'pin', callout: '8 h9' })
		);
		expect(fourth.ok && fourth.feature.balloon).toBe(first.balloon + 3);
	});

	it('refuse a bad callout with the position, storing nothing', async () => {
		const place = await newRevision();
		const bad = await addFeature(
			database.db,
			actor,
			place,
			input({ kind: 'hole', callout: 'Ø12 H7x' })
		);
		expect(bad).toMatchObject({ ok: false, status: 400, code: 'invalid', field: 'callout' });
		expect(bad.ok === false && typeof bad.position).toBe('number');
		expect(await featuresOf(database.db, place)).toEqual([]);
		expect(() => input({ kind: 'hole', callout: '' })).toThrow(/datum feature/);
		const offSheet = await addFeature(
			database.db,
			actor,
			place,
			input({ kind: 'hole', callout: 'Ø12 H7', location: { sheet: 3, x: 0.1, y: 0.1 } })
		);
		expect(offSheet).toMatchObject({ ok: false, status: 400, field: 'location' });
	});

	it('are edited against a version: stale edits get the current feature; the trail keeps before and after', async () => {
		const place = await newRevision();
		const created = await addFeature(
			database.db,
			actor,
			place,
			input({ kind: 'hole', callout: 'Ø12 H7' })
		);
		if (!created.ok) throw new Error(created.message);
		const id = created.feature.id;
		const moved = await editFeature(
			database.db,
			actor,
			place,
			await row(place, id),
			patch({ version: 1, location: { sheet: 2, x: 0.5, y: 0.5 } })
		);
		expect(moved).toMatchObject({ ok: true, feature: { version: 2, location: { sheet: 2 } } });
		const stale = await editFeature(
			database.db,
			actor,
			place,
			await row(place, id),
			patch({ version: 1, label: 'late' })
		);
		expect(stale).toMatchObject({
			ok: false,
			status: 409,
			code: 'stale',
			current: { id, version: 2, upper: '12.018' }
		});
		const recoded = await editFeature(
			database.db,
			actor,
			place,
			await row(place, id),
			patch({ version: 2, callout: '12 f7' })
		);
		// ISO 286-2:2010, table 3 (f, over 10 to 18 mm): es = −16 µm; IT7 = 18 µm.
		expect(recoded).toMatchObject({
			ok: true,
			feature: { internal: false, upper: '11.984', lower: '11.966', version: 3 }
		});
		const trail = await database.db.select().from(activity).where(eq(activity.entityId, id));
		const update = trail.find(
			(a) => a.action === 'update' && (a.after as { version: number }).version === 3
		);
		expect(update?.before).toMatchObject({ callout: 'Ø12 H7', internal: true });
		expect(update?.after).toMatchObject({ callout: '12 f7', internal: false });
	});

	it('take their datums from datum features, faces included, and judge each feature', async () => {
		const place = await newRevision();
		const face = await addFeature(
			database.db,
			actor,
			place,
			input({ kind: 'other', label: 'Base face', datumFeature: 'a' })
		);
		expect(face).toMatchObject({
			ok: true,
			feature: { datumFeature: 'A', callout: '', problem: null }
		});
		const position = (datums: string[]) => ({
			kind: 'hole',
			callout: 'Ø12 H7',
			controls: [
				{ characteristic: 'position', value: '0.05', diameterZone: true, modifier: 'mmc', datums }
			]
		});
		const onA = await addFeature(database.db, actor, place, input(position(['A'])));
		if (!onA.ok) throw new Error(onA.message);
		// PRODUCT.md §4: hole VC = MMC − t = 12.000 − 0.05; RC = LMC + t + T = 12.018 + 0.05 + 0.018.
		expect(onA.feature).toMatchObject({ virtualCondition: '11.950', resultantCondition: '12.086' });
		expect(onA.feature.findings.map((f) => f.rule)).not.toContain('GEO-04');
		const onB = await addFeature(database.db, actor, place, input(position(['B'])));
		if (!onB.ok) throw new Error(onB.message);
		expect(onB.feature.findings.map((f) => f.rule)).toContain('GEO-04');
	});

	it('do not change on an approved or released revision', async () => {
		const place = await newRevision();
		const created = await addFeature(
			database.db,
			actor,
			place,
			input({ kind: 'hole', callout: 'Ø12 H7' })
		);
		if (!created.ok) throw new Error(created.message);
		for (const state of ['approved', 'released'] as const) {
			await database.db.update(revisions).set({ state }).where(eq(revisions.id, place.revision.id));
			const added = await addFeature(
				database.db,
				actor,
				place,
				input({ kind: 'pin', callout: '6 h6' })
			);
			expect(added).toMatchObject({ ok: false, status: 409, code: 'frozen' });
			const edited = await editFeature(
				database.db,
				actor,
				place,
				await row(place, created.feature.id),
				patch({ version: 1, label: 'x' })
			);
			expect(edited).toMatchObject({ ok: false, status: 409, code: 'frozen' });
			const removed = await removeFeature(
				database.db,
				actor,
				place,
				await row(place, created.feature.id),
				1
			);
			expect(removed).toMatchObject({ ok: false, status: 409, code: 'frozen' });
		}
		expect((await featuresOf(database.db, place)).map((f) => f.label)).toEqual(['']);
	});
});

async function row(place: FeaturePlace, id: string) {
	const found = await getFeature(database.db, place.revision.id, id);
	if (!found) throw new Error(`no feature ${id}`);
	return found;
}
