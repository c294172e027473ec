/*
 * The rulebook on stored drawings: every rule tripped once through the services (features and
 * fits written as a user writes them, findings kept by the in-transaction re-check), with the
 * numbers the core gives on the same data; clean drawings trip nothing; findings are never
 * duplicated, resolve when their cause goes away and come back when it returns; waivers lapse
 * when the numbers change; a change on one drawing re-checks the fit on the other.
 * Check values: the numbers come from the rule tests (tests/unit/rulebook.test.ts), whose
 * sources are named there; ISO 286-2:2010 tables for the classes used here.
 */
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../src/lib/server/db/connect';
import { activity, findingMoves, revisions, teams } from '../../src/lib/server/db/schema';
import type { DrawingRow, FindingRow, TeamRow } from '../../src/lib/server/db/schema';
import type { Actor } from '../../src/lib/server/db/queries/activity';
import { createDrawing, insertRevision } from '../../src/lib/server/db/queries/drawings';
import { getFeature } from '../../src/lib/server/db/queries/features';
import { listFindings } from '../../src/lib/server/db/queries/findings';
import { getFit } from '../../src/lib/server/db/queries/fits';
import { updateTeamSettings } from '../../src/lib/server/db/queries/teams';
import {
	addFeature,
	editFeature,
	removeFeature,
	type FeaturePlace
} from '../../src/lib/server/features';
import { addFit, removeFit } from '../../src/lib/server/fits';
import { changeFinding } from '../../src/lib/server/findings';
import { checkSummaryOf, runCheck } from '../../src/lib/server/rulebook';
import { featureInput, featurePatch } from '../../src/lib/schemas/features';
import { fitCreate } from '../../src/lib/schemas/fits';
import { findingPatch } from '../../src/lib/schemas/findings';
import {
	evaluate,
	type RulebookDrawing,
	type RulebookFeature,
	type RulebookFit
} from '../../src/lib/tolerance/rulebook';
import type { GeometricControl } from '../../src/lib/tolerance/feature';
import { freshDatabase, teamWithTwoDrawings } from './harness';

let database: Database;
let actor: Actor;
let team: TeamRow;
let made = 0;

beforeAll(async () => {
	database = await freshDatabase();
	({ actor, team } = await teamWithTwoDrawings(database.db));
});
afterAll(() => database?.close());

const iso: RulebookDrawing = {
	units: 'mm',
	standard: 'iso-8015',
	generalTolerance: { kind: 'iso2768', linear: 'm' },
	notes: 'ISO 8015'
};
const asme: RulebookDrawing = {
	units: 'in',
	standard: 'asme-y14.5-2018',
	generalTolerance: { kind: 'decimal-places', byPlaces: { '2': '0.01', '3': '0.005' } },
	notes: 'ASME Y14.5-2018'
};
const asmeMm: RulebookDrawing = {
	units: 'mm',
	standard: 'asme-y14.5-2018',
	generalTolerance: { kind: 'iso2768', linear: 'm' }
};

function control(
	characteristic: GeometricControl['characteristic'],
	value: string,
	modifier: GeometricControl['modifier'] = 'rfs',
	datums: string[] = []
): GeometricControl {
	const median = ['position', 'concentricity', 'symmetry', 'perpendicularity'].includes(
		characteristic
	);
	return {
		characteristic,
		value,
		diameterZone: median,
		appliesTo: median ? 'median' : 'surface',
		modifier,
		datums
	};
}

let n = 0;
function feature(
	callout: string,
	internal: boolean,
	more: Partial<RulebookFeature> = {}
): RulebookFeature {
	return { id: `f${++n}`, kind: internal ? 'hole' : 'shaft', internal, callout, ...more };
}

function fit(hole: RulebookFeature, shaft: RulebookFeature, more: Partial<RulebookFit> = {}) {
	return {
		id: `fit${++n}`,
		holeFeatureId: hole.id,
		shaftFeatureId: shaft.id,
		intent: 'running',
		...more
	} as RulebookFit;
}

/** A new drawing with the given settings and its revision A. */
async function newDrawing(d: RulebookDrawing): Promise<FeaturePlace & { team: TeamRow }> {
	const drawing = (await createDrawing(database.db, actor, team.id, {
		number: `RB-${++made}`,
		title: 'Rulebook case',
		units: d.units,
		standard: d.standard,
		generalTolerance: d.generalTolerance,
		notes: d.notes ?? ''
	})) as DrawingRow;
	const revision = await insertRevision(database.db, actor, drawing, {
		letter: 'A',
		pages: 1,
		sheets: [{ width: 1190.55, height: 841.89 }],
		sha256: 'a'.repeat(64),
		size: 1000,
		storageKey: `test/${drawing.number}-A.pdf`
	});
	const [fresh] = await database.db.select().from(teams).where(eq(teams.id, team.id));
	return { team: fresh, drawing, revision };
}

interface Stored {
	place: FeaturePlace & { team: TeamRow };
	/** Fixture id → stored id, and back. */
	ids: Map<string, string>;
	back: Map<string, string>;
}

/** Stores a rulebook case through the services: its datum faces, features, then fits. */
async function store(d: RulebookDrawing, features: RulebookFeature[], fits: RulebookFit[] = []) {
	const place = await newDrawing(d);
	const ids = new Map<string, string>();
	for (const letter of d.datums ?? []) {
		const face = await addFeature(
			database.db,
			actor,
			place,
			featureInput.parse({ kind: 'other', label: `Datum ${letter}`, datumFeature: letter })
		);
		if (!face.ok) throw new Error(face.message);
	}
	for (const f of features) {
		const added = await addFeature(
			database.db,
			actor,
			place,
			featureInput.parse({
				label: f.label ?? f.id,
				kind: f.kind,
				internal: f.internal,
				callout: f.callout,
				controls: f.controls ?? [],
				datumFeature: f.datumFeature ?? null,
				boughtOut: f.boughtOut ?? false,
				...(f.overrides ? { overrides: f.overrides } : {}),
				...(f.quantity ? { quantity: f.quantity } : {})
			})
		);
		if (!added.ok) throw new Error(`${f.callout}: ${added.message}`);
		ids.set(f.id, added.feature.id);
	}
	for (const x of fits) {
		const added = await addFit(
			database.db,
			actor,
			place,
			fitCreate.parse({
				holeFeatureId: ids.get(x.holeFeatureId),
				shaftFeatureId: x.shaftFeatureId ? ids.get(x.shaftFeatureId) : null,
				fixedHoleFeatureId: x.fixedHoleFeatureId ? ids.get(x.fixedHoleFeatureId) : null,
				fastener: x.fastener ? { label: '', ...x.fastener } : null,
				intent: x.intent,
				requiredMinClearance: x.requiredMinClearance ?? null,
				requiredMaxClearance: x.requiredMaxClearance ?? null,
				sharedDatumFrame: x.sharedDatumFrame ?? false
			})
		);
		if (!added.ok) throw new Error(`fit: ${added.message}`);
		ids.set(x.id, added.fit.id);
	}
	const back = new Map([...ids].map(([k, v]) => [v, k]));
	return { place, ids, back } satisfies Stored;
}

async function ruleFindings(s: Stored) {
	return listFindings(database.db, s.place.revision.id, { kind: 'rule' });
}

/** A stored finding's key in the fixture's ids, with its numbers and severity. */
function asFixture(s: Stored, f: FindingRow) {
	const line = `${f.ruleKey} ${f.severity} ${f.ruleNumbers}`;
	return line.replace(/[0-9a-f]{8}-[0-9a-f-]{27}/g, (id) => s.back.get(id) ?? id);
}

/** What the core finds on the same data, as the stored findings are compared. */
function coreOn(d: RulebookDrawing, features: RulebookFeature[], fits: RulebookFit[] = []) {
	return evaluate({ drawing: d, features, fits }).map((r) => `${r.key} ${r.severity} ${r.line}`);
}

/** Stores the case and expects the stored rule findings to be exactly the core's results. */
async function expectStoredAsCore(
	d: RulebookDrawing,
	features: RulebookFeature[],
	fits: RulebookFit[] = []
) {
	const s = await store(d, features, fits);
	const stored = (await ruleFindings(s)).filter((f) => f.state === 'raised');
	expect(stored.map((f) => asFixture(s, f)).sort()).toEqual(coreOn(d, features, fits).sort());
	return { s, stored };
}

const position0 = () => control('position', '0', 'mmc');

/** One case per rule; `line` is the numbers line of the rule's finding (tests/unit/rulebook.test.ts). */
const cases: {
	rule: string;
	drawing: RulebookDrawing;
	make: () => { features: RulebookFeature[]; fits?: RulebookFit[] };
	line?: string;
}[] = [
	{
		rule: 'LIM-01',
		drawing: iso,
		make: () => ({ features: [feature('(2.4)', true, { kind: 'slot' })] }),
		line: '(2.4): reference dimension: information only, no tolerance'
	},
	{
		rule: 'LIM-02',
		drawing: iso,
		// Deviations written in the wrong order that still give a valid band (minor).
		make: () => ({ features: [feature('Ø25 +0.01/+0.03', true)] })
	},
	{
		rule: 'LIM-03',
		drawing: asme,
		make: () => ({ features: [feature('Ø.250-.2515', true)] }),
		line: 'Ø.250-.2515: lower limit 3 places, upper limit 4'
	},
	{
		rule: 'LIM-04',
		drawing: iso,
		make: () => ({ features: [feature('Ø25 H7 (25.000/25.025)', true)] }),
		// ISO 286-2:2010 table: H7 over 18 up to 30 mm is 0/+0.021.
		line: 'stated 25.000–25.025, H7 at 25.000 gives 25.000–25.021 (ISO 286-2)'
	},
	{
		rule: 'LIM-05',
		drawing: iso,
		make: () => {
			const hole = feature('10 MAX', true, { controls: [position0()] });
			const shaft = feature('9.98 MAX', false, { controls: [position0()] });
			return { features: [hole, shaft], fits: [fit(hole, shaft)] };
		}
	},
	{
		rule: 'ENV-01',
		drawing: asme,
		make: () => ({
			features: [
				feature('.250 ±.005', false, { kind: 'tab', controls: [control('flatness', '.015')] })
			]
		})
	},
	{
		rule: 'ENV-02',
		drawing: iso,
		make: () => {
			const bore = feature('Ø12 H7', true, { controls: [control('circularity', '0.005')] });
			const journal = feature('Ø12 g6 Ⓔ', false, { controls: [position0()] });
			return { features: [bore, journal], fits: [fit(bore, journal)] };
		}
	},
	{
		rule: 'ENV-03',
		drawing: asme,
		make: () => {
			const hole = feature('.2510-.2520', true, { controls: [position0()] });
			const pin = feature('.2490-.2500', false, {
				overrides: { envelope: false, independency: true, stock: false, freeState: false }
			});
			return { features: [hole, pin], fits: [fit(hole, pin)] };
		}
	},
	{
		rule: 'ENV-04',
		drawing: { units: 'mm', standard: 'unstated', generalTolerance: null },
		make: () => ({ features: [feature('25.000-25.021', true)] })
	},
	{
		rule: 'GEO-01',
		drawing: { ...iso, datums: ['A'] },
		make: () => ({
			features: [feature('(8)', true, { controls: [control('position', '0.1', 'mmc', ['A'])] })]
		})
	},
	{
		rule: 'GEO-02',
		drawing: iso,
		make: () => ({
			features: [feature('Ø12 g6 Ⓔ', false, { controls: [control('cylindricity', '0.01', 'mmc')] })]
		})
	},
	{
		rule: 'GEO-03',
		drawing: { ...iso, datums: ['A'] },
		make: () => ({
			features: [feature('Ø6.6', true, { controls: [control('position', '0', 'rfs', ['A'])] })]
		})
	},
	{
		rule: 'GEO-04',
		drawing: { ...iso, datums: ['A', 'B'] },
		make: () => ({
			features: [
				feature('Ø6.6', true, { controls: [control('position', '0.2', 'mmc', ['A', 'C'])] })
			]
		})
	},
	{
		rule: 'FIT-01',
		drawing: iso,
		make: () => {
			const hole = feature('Ø6 H7 Ⓔ', true, { controls: [position0()] });
			const pin = feature('Ø6 h6 Ⓔ', false, { kind: 'pin', controls: [position0()] });
			return { features: [hole, pin], fits: [fit(hole, pin)] };
		},
		// ISO 286-2:2010 tables: H7 and h6 both have 6.000 as their MMC size.
		line: 'MMC hole 6.000 − MMC pin 6.000 = 0.000, required > 0 for a running fit'
	},
	{
		rule: 'FIT-02',
		drawing: iso,
		make: () => {
			const bore = feature('Ø12 H7 Ⓔ', true, { controls: [position0()] });
			const journal = feature('Ø12 g6', false, {
				controls: [
					{ ...control('straightness', '0.02', 'mmc'), diameterZone: true, appliesTo: 'median' }
				]
			});
			return { features: [bore, journal], fits: [fit(bore, journal)] };
		}
	},
	{
		rule: 'FIT-03',
		drawing: iso,
		make: () => {
			const hole = feature('Ø3 H7 Ⓔ', true, { controls: [position0()] });
			const shaft = feature('Ø3 p6 Ⓔ', false, { controls: [position0()] });
			return { features: [hole, shaft], fits: [fit(hole, shaft, { intent: 'interference' })] };
		}
	},
	{
		rule: 'FIT-04',
		drawing: iso,
		make: () => {
			const hole = feature('Ø12 H8 Ⓔ', true, { controls: [position0()] });
			const shaft = feature('Ø12 f7 Ⓔ', false, { controls: [position0()] });
			return {
				features: [hole, shaft],
				fits: [fit(hole, shaft, { requiredMaxClearance: '0.060' })]
			};
		},
		// ISO 286-2:2010 tables: H8 at 12 mm is 0/+0.027, f7 is −0.016/−0.034.
		line: 'LMC hole 12.027 − LMC shaft 11.966 = 0.061, stated maximum 0.060'
	},
	{
		rule: 'FIT-05',
		drawing: { ...iso, datums: ['A', 'B'] },
		make: () => {
			const holes = feature('4X Ø6.6', true, {
				quantity: 4,
				controls: [control('position', '0.5', 'mmc', ['A', 'B'])]
			});
			const bolts: RulebookFit = {
				id: `fit${++n}`,
				holeFeatureId: holes.id,
				fastener: { callout: 'M6' },
				intent: 'floating-fastener'
			};
			return { features: [holes], fits: [bolts] };
		},
		line: 'position 0.5 > H 6.4 − F 6.0 = 0.4 (floating fastener: T = H − F)'
	},
	{
		rule: 'FIT-06',
		drawing: iso,
		make: () => {
			const hole = feature('Ø12 H7 Ⓔ', true);
			const shaft = feature('Ø12 g6 Ⓔ', false);
			return { features: [hole, shaft], fits: [fit(hole, shaft)] };
		}
	},
	{
		rule: 'DOC-01',
		drawing: { units: 'mm', standard: 'iso-8015', generalTolerance: null },
		make: () => ({ features: [feature('8', true, { kind: 'slot' })] })
	},
	{
		rule: 'DOC-02',
		drawing: { ...iso, generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' } },
		make: () => ({ features: [feature('Ø12 H7 Ⓔ', true)] })
	}
];

describe('each rule on stored data', () => {
	for (const c of cases) {
		it(`${c.rule}: stored as a rule finding with the core's key, severity and numbers`, async () => {
			const { features, fits = [] } = c.make();
			const { stored } = await expectStoredAsCore(c.drawing, features, fits);
			const mine = stored.filter((f) => f.rule === c.rule);
			expect(mine.length, c.rule).toBeGreaterThanOrEqual(1);
			if (c.line) expect(mine.map((f) => f.ruleNumbers)).toContain(c.line);
			for (const f of mine) {
				expect(f.kind).toBe('rule');
				expect(f.text).toContain(`Numbers: ${f.ruleNumbers}`);
				expect(f.text).toContain('Fix: ');
				expect(f.text).toContain(`Rule: /rules/${c.rule}`);
				expect(f.raisedBy).toBeNull();
			}
		});
	}

	it('LIM-06 follows the team capability grade set by an admin', async () => {
		const s = await store(iso, [feature('12.000-12.008', false)]);
		expect(await ruleFindings(s)).toEqual([]);
		const [current] = await database.db.select().from(teams).where(eq(teams.id, team.id));
		const saved = await updateTeamSettings(
			database.db,
			actor,
			team.id,
			{ capabilityGrade: 'IT7' },
			current.version
		);
		expect(saved).not.toBeNull();
		try {
			const [lim] = await ruleFindings(s);
			expect(lim.rule).toBe('LIM-06');
			expect(lim.severity).toBe('note');
			// ISO 286-1:2010 table 1: IT7 over 10 up to 18 mm is 18 µm.
			expect(lim.ruleNumbers).toContain('size tolerance 0.008 < IT7 0.018');
		} finally {
			await updateTeamSettings(database.db, actor, team.id, { capabilityGrade: null });
		}
		expect((await ruleFindings(s))[0].state).toBe('resolved');
	});
});

describe('clean drawings', () => {
	const located = (callout: string, internal: boolean) =>
		feature(callout, internal, {
			kind: internal ? 'bore' : 'shaft',
			controls: [control('position', '0', 'mmc', ['A'])]
		});
	it('ISO: an H7/g6 running fit with Ⓔ, located from a datum, trips nothing', async () => {
		const bore = located('Ø12 H7 Ⓔ', true);
		const journal = located('Ø12 g6 Ⓔ', false);
		const { s } = await expectStoredAsCore(
			{ ...iso, datums: ['A'] },
			[bore, journal],
			[fit(bore, journal)]
		);
		expect(await ruleFindings(s)).toEqual([]);
	});
	it('ASME, mm: the same pair under Rule #1 trips nothing', async () => {
		const bore = located('Ø12 H7', true);
		const journal = located('Ø12 g6', false);
		const d = { ...asmeMm, generalTolerance: null, datums: ['A'] };
		const { s } = await expectStoredAsCore(d, [bore, journal], [fit(bore, journal)]);
		expect(await ruleFindings(s)).toEqual([]);
	});
	it('ASME, inch: a .2510-.2520 hole on a .2490-.2500 pin trips nothing', async () => {
		const hole = located('.2510-.2520', true);
		const pin = located('.2490-.2500', false);
		const { s } = await expectStoredAsCore(
			{ ...asme, datums: ['A'] },
			[hole, pin],
			[fit(hole, pin)]
		);
		expect(await ruleFindings(s)).toEqual([]);
	});
});

async function edit(s: Stored, fixtureId: string, patch: Record<string, unknown>) {
	const row = await getFeature(database.db, s.place.revision.id, s.ids.get(fixtureId)!);
	const done = await editFeature(
		database.db,
		actor,
		s.place,
		row!,
		featurePatch.parse({ ...patch, version: row!.version })
	);
	if (!done.ok) throw new Error(done.message);
	return done.feature;
}

async function patchFinding(s: Stored, finding: FindingRow, patch: Record<string, unknown>) {
	const done = await changeFinding(
		database.db,
		{ user: actor, role: 'checker' },
		s.place,
		finding,
		findingPatch.parse({ ...patch, version: finding.version })
	);
	if (!done.ok) throw new Error(done.message);
	return done.finding;
}

async function only(s: Stored) {
	const list = await ruleFindings(s);
	expect(list).toHaveLength(1);
	return list[0];
}

async function historyOf(id: string) {
	return database.db
		.select()
		.from(findingMoves)
		.where(eq(findingMoves.findingId, id))
		.orderBy(findingMoves.id);
}

describe('findings that keep themselves true', () => {
	// ISO 286-2:2010 table: H7 over 18 up to 30 mm is 0/+0.021, so 25.025 disagrees (LIM-04).
	const wrong = 'Ø25 H7 (25.000/25.025)';
	it('a re-run adds nothing; a fix resolves; breaking it again raises the same finding', async () => {
		const bore = feature(wrong, true, { label: 'Bore' });
		const s = await store(iso, [bore]);
		const first = await only(s);
		expect(first).toMatchObject({ rule: 'LIM-04', state: 'raised', severity: 'major' });

		const checked = await runCheck(database.db, actor, s.place.revision);
		expect(checked.ok && checked.summary).toMatchObject({ total: 1, open: 1, waived: 0 });
		expect(checked.ok && checked.summary.bySeverity.major.open).toBe(1);
		expect(checked.ok && checked.summary.byFamily.LIM.open).toBe(1);
		const again = await only(s);
		expect([again.id, again.number, again.version]).toEqual([
			first.id,
			first.number,
			first.version
		]);

		await edit(s, bore.id, { callout: 'Ø25 H7 (25.000/25.021)' });
		const fixed = await only(s);
		expect(fixed.state).toBe('resolved');
		const resolvedMove = (await historyOf(fixed.id)).at(-1)!;
		expect(resolvedMove).toMatchObject({ from: 'raised', to: 'resolved', byId: null });
		expect(resolvedMove.message).toMatch(/no longer finds/);

		await edit(s, bore.id, { callout: wrong });
		const back = await only(s);
		expect([back.id, back.state]).toEqual([first.id, 'raised']);
		expect((await historyOf(back.id)).at(-1)!.message).toContain('25.025');
	});

	it('a waiver holds until the numbers behind the finding change, then lapses into the history', async () => {
		const bore = feature(wrong, true, { label: 'Bore' });
		const s = await store(iso, [bore]);
		const waived = await patchFinding(s, await only(s), {
			waiver: { reason: 'The shop reams to 25.025; agreed with the customer' }
		});
		expect(waived.waiver).toMatchObject({ by: actor.id, reason: expect.stringContaining('reams') });
		// Re-runs and edits that leave the numbers alone keep it.
		await runCheck(database.db, actor, s.place.revision);
		await edit(s, bore.id, { label: 'Main bore' });
		expect((await only(s)).waiver).not.toBeNull();
		let summary = await checkSummaryOf(database.db, s.place.revision.id);
		expect(summary).toMatchObject({ open: 0, waived: 1 });
		expect(summary.bySeverity.major).toEqual({ open: 0, waived: 1, closed: 0 });

		await edit(s, bore.id, { callout: 'Ø25 H7 (25.000/25.030)' });
		const lapsed = await only(s);
		expect(lapsed.waiver).toBeNull();
		expect(lapsed.state).toBe('raised');
		const note = (await historyOf(lapsed.id)).at(-1)!;
		expect(note.message).toMatch(/Waiver lapsed/);
		expect(note.message).toContain('25.025');
		expect(note.message).toContain('25.030');
		expect(note.message).toContain('reams to 25.025');
		summary = await checkSummaryOf(database.db, s.place.revision.id);
		expect(summary).toMatchObject({ open: 1, waived: 0 });

		// Taken back by the checker: null again, and the history says so.
		const again = await patchFinding(s, lapsed, { waiver: { reason: 'Agreed again' } });
		const row = await only(s);
		expect(again.waiver).not.toBeNull();
		const withdrawn = await patchFinding(s, row, { waiver: null });
		expect(withdrawn.waiver).toBeNull();
		expect((await historyOf(row.id)).map((m) => m.message)).toEqual(
			expect.arrayContaining(['Waived: Agreed again', expect.stringMatching(/^Waiver taken back/)])
		);
	});

	it('removing the feature resolves its findings; a fit delete resolves the fit findings', async () => {
		const hole = feature('Ø6 H7 Ⓔ', true, { controls: [position0()] });
		const pin = feature('Ø6 h6 Ⓔ', false, { kind: 'pin', controls: [position0()] });
		const pair = fit(hole, pin);
		const s = await store(iso, [hole, pin], [pair]);
		const fit01 = (await ruleFindings(s)).find((f) => f.rule === 'FIT-01')!;
		expect(fit01.fitId).toBe(s.ids.get(pair.id));
		const fitRow = (await getFit(database.db, s.place.revision.id, s.ids.get(pair.id)!))!;
		const removed = await removeFit(database.db, actor, s.place, fitRow, fitRow.version);
		expect(removed.ok).toBe(true);
		const after = (await ruleFindings(s)).find((f) => f.id === fit01.id)!;
		expect(after.state).toBe('resolved');

		const slot = feature('(2.4)', true, { kind: 'slot' });
		const alone = await store(iso, [slot]);
		const lim01 = await only(alone);
		expect(lim01.rule).toBe('LIM-01');
		const row = (await getFeature(database.db, alone.place.revision.id, alone.ids.get(slot.id)!))!;
		expect((await removeFeature(database.db, actor, alone.place, row, row.version)).ok).toBe(true);
		const gone = await only(alone);
		expect([gone.id, gone.state, gone.featureId]).toEqual([lim01.id, 'resolved', null]);
	});
});

describe('fits across drawings', () => {
	it('a change on the shaft drawing re-checks the fit on the hole drawing, unless it is frozen', async () => {
		const bore = feature('Ø12 H7 Ⓔ', true, { label: 'Bore', controls: [position0()] });
		const journal = feature('Ø12 g6 Ⓔ', false, { label: 'Journal', controls: [position0()] });
		const holeSide = await store(iso, [bore]);
		const shaftSide = await store(iso, [journal]);
		const added = await addFit(
			database.db,
			actor,
			holeSide.place,
			fitCreate.parse({
				holeFeatureId: holeSide.ids.get(bore.id),
				shaftFeatureId: shaftSide.ids.get(journal.id),
				intent: 'running'
			})
		);
		expect(added.ok).toBe(true);
		expect(await ruleFindings(holeSide)).toEqual([]);

		// h6 at 12 mm: MMC 12.000, so the running fit has no allowance (ISO 286-2:2010 tables).
		await edit(shaftSide, journal.id, { callout: 'Ø12 h6 Ⓔ' });
		const [fit01] = await ruleFindings(holeSide);
		expect(fit01).toMatchObject({ rule: 'FIT-01', state: 'raised' });
		expect(fit01.ruleNumbers).toBe(
			'MMC hole 12.000 − MMC shaft 12.000 = 0.000, required > 0 for a running fit'
		);
		expect(await ruleFindings(shaftSide)).toEqual([]);

		// The hole's revision is approved: left as it was, and a note says so.
		await database.db
			.update(revisions)
			.set({ state: 'approved' })
			.where(eq(revisions.id, holeSide.place.revision.id));
		await edit(shaftSide, journal.id, { callout: 'Ø12 g6 Ⓔ' });
		const [kept] = await ruleFindings(holeSide);
		expect([kept.state, kept.version]).toEqual(['raised', fit01.version]);
		const notes = await database.db
			.select()
			.from(activity)
			.where(
				and(eq(activity.drawingId, shaftSide.place.drawing.id), eq(activity.action, 'rulebook'))
			);
		expect(notes.map((a) => a.summary).join('\n')).toMatch(
			new RegExp(`Revision A of ${holeSide.place.drawing.number} is approved: .*left as it was`)
		);
	});
});
