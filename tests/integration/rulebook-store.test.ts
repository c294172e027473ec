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
import { listFindings } from '../../src/lib/server/db/queries/findings';
import { updateTeamSettings } from '../../src/lib/server/db/queries/teams';
import {
	addFeature,
	editFeature,
	removeFeature,
	type FeaturePlace
} from '../../src/lib/server/features';
import { addFit, editFit, removeFit } from '../../src/lib/server/fits';
import { changeFinding } from '../../src/lib/server/findings';
import { checkSummaryOf, runCheck } from '../../src/lib/server/rulebook';
import { featureInput, featurePatch } from '../../src/lib/schemas/features';
import { fitCreate, fitPatch } from '../../src/lib/schemas/fits';
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
