import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { asc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { activity } from '../../src/lib/server/db/schema';
import type { Database } from '../../src/lib/server/db/connect';
import { getDrawing, getRevision } from '../../src/lib/server/db/queries/drawings';
import { getTeamBySlug } from '../../src/lib/server/db/queries/teams';
import { demoDrawings } from '../../src/lib/server/demo/drawings';
import { seedDemo } from '../../src/lib/server/demo/seed';
import { featuresOf } from '../../src/lib/server/features';
import { fitsOf } from '../../src/lib/server/fits';
import { findingsOf } from '../../src/lib/server/findings';
import { transitionsOf } from '../../src/lib/server/transitions';
import { commentsOf, findingThread } from '../../src/lib/server/comments';
import {
	blockingFindings,
	getFinding,
	listFindings
} from '../../src/lib/server/db/queries/findings';
import { demoWaiverReason } from '../../src/lib/server/demo/review-loop';
import { createStorage } from '../../src/lib/server/storage';
import { freshDatabase, startFakes, tempDir } from './harness';

let database: Database;
let fakes: Awaited<ReturnType<typeof startFakes>>;
let temp: ReturnType<typeof tempDir>;

async function placeOf(number: string) {
	const team = (await getTeamBySlug(database.db, 'kestrel'))!;
	const drawing = (await getDrawing(database.db, team.id, number))!;
	const revision = (await getRevision(database.db, drawing.id, 'A'))!;
	return { team, drawing, revision };
}

async function boardOf(number: string) {
	return featuresOf(database.db, await placeOf(number));
}

beforeAll(async () => {
	database = await freshDatabase();
	fakes = await startFakes();
	temp = tempDir();
	const storage = createStorage(fakes.storageSettings);
	await seedDemo(database.db, 'demo password 1', storage, temp.dir);
	// A second start (or a second instance) adds nothing.
	await seedDemo(database.db, 'demo password 1', storage, temp.dir);
}, 120_000);
afterAll(async () => {
	await database?.close();
	await fakes?.stop();
	temp?.remove();
});

describe('the demo board', () => {
	/** A balloon on the callout's line, just right of its text's end: beside it, not on it. */
	const beside = (
		location: { sheet: number; x: number; y: number } | null,
		drawn: { sheet: number; x: number; y: number; w: number }
	) => {
		const end = drawn.x + drawn.w / 2;
		expect(location).toMatchObject({ sheet: drawn.sheet, y: drawn.y });
		expect(location!.x).toBeGreaterThan(end);
		expect(location!.x).toBeLessThan(end + 0.03);
	};

	it('has every feature placed beside its callout on the sheet', async () => {
		const bushing = await boardOf('KF-1003');
		const sheet = demoDrawings.find((d) => d.number === 'KF-1003')!;
		expect(bushing.map((f) => [f.balloon, f.label, f.callout])).toEqual([
			[1, 'Bore', 'Ø12 H7'],
			[2, 'Outside diameter', 'Ø18 p6 Ⓔ'],
			[3, 'Length', '20']
		]);
		for (const f of bushing) {
			const drawn = sheet.callouts.find((c) => c.kind === 'size' && c.text === f.callout)!;
			beside(f.location, drawn);
		}
		// ISO 286-2:2010, table 2 (H, over 10 to 18 mm) with IT7 = 18 µm from table 1.
		expect(bushing[0]).toMatchObject({ upper: '12.018', lower: '12.000' });
	});

	it('defines datum A by a plain face at its symbol, so the position frame refers to defined datums', async () => {
		const housing = await boardOf('KF-1001');
		const face = housing.find((f) => f.datumFeature === 'A')!;
		expect(face).toMatchObject({ kind: 'other', callout: '', label: 'Front face', problem: null });
		const symbol = demoDrawings
			.find((d) => d.number === 'KF-1001')!
			.callouts.find((c) => c.kind === 'datum' && c.text === 'A')!;
		beside(face.location, symbol);
		const bolts = housing.find((f) => f.label === 'Cover bolt holes')!;
		expect(bolts.quantity).toBe(4);
		expect(bolts.findings.map((f) => f.rule)).not.toContain('GEO-04');
		for (const number of ['KF-1001', 'KF-1002', 'KF-1003', 'KF-2001']) {
			const board = await boardOf(number);
			expect(board.length, number).toBeGreaterThan(0);
			expect(
				board.every((f) => f.location !== null && f.problem === null),
				number
			).toBe(true);
		}
	});

	it("has the demo's fits: the journal in the bushing gives 0.006 / 0.035, listed on both drawings", async () => {
		const bushing = await fitsOf(database.db, await placeOf('KF-1003'));
		const journal = bushing.find((f) => f.members.shaft?.drawing === 'KF-1002')!;
		// ISO 286-2:2010: H7 over 10 to 18 mm is 0/+0.018, g6 is -0.006/-0.017.
		expect(journal).toMatchObject({
			owned: true,
			intent: 'running',
			minClearance: '0.006',
			maxClearance: '0.035',
			problem: null
		});
		const shaft = await fitsOf(database.db, await placeOf('KF-1002'));
		expect(shaft.map((f) => [f.id, f.owned])).toEqual([[journal.id, false]]);
		const housing = await fitsOf(database.db, await placeOf('KF-1001'));
		expect(housing.map((f) => f.intent).sort()).toEqual([
			'floating-fastener',
			'interference',
			'transition'
		]);
		expect(housing.every((f) => f.problem === null)).toBe(true);
		const bracket = await fitsOf(database.db, await placeOf('KF-2001'));
		expect(bracket).toHaveLength(1);
	});

	it('has manual findings with short threads between the checker and the drafter, seeded once', async () => {
		const byDrawing: Record<string, string[]> = {};
		for (const number of ['KF-1001', 'KF-1002', 'KF-1003', 'KF-2001']) {
			const place = await placeOf(number);
			const list = await findingsOf(database.db, place, { kind: 'manual' });
			byDrawing[number] = list.map((f) => `F-${f.number} ${f.severity} ${f.state}`);
			for (const f of list) {
				expect(f).toMatchObject({ kind: 'manual', rule: null });
				expect(f.location, `F-${f.number}`).not.toBeNull();
			}
		}
		// Seeded twice (beforeAll), numbered once.
		expect(byDrawing).toEqual({
			// Numbered after the rulebook's own findings, raised as the drawings were made.
			'KF-1001': ['F-5 minor resolved', 'F-6 note resolved'],
			'KF-1002': ['F-2 major answered'],
			'KF-1003': [],
			'KF-2001': ['F-5 note withdrawn']
		});
		const shaft = await placeOf('KF-1002');
		const [keyway] = await findingsOf(database.db, shaft, { kind: 'manual' });
		const finding = (await getFinding(database.db, shaft.revision.id, keyway.id))!;
		const thread = await commentsOf(database.db, findingThread(shaft, finding));
		expect(thread).toHaveLength(2);
		// "@tomas" is the demo drafter, a member of the team.
		expect(thread[0].html).toContain('class="mention"');
		expect(thread[0].html).toContain('<li>');
		const housing = await placeOf('KF-1001');
		const [anodise] = await findingsOf(database.db, housing, { kind: 'manual' });
		expect(anodise.location).toMatchObject({ w: 0.3, h: 0.035 });
	});

	it('takes KF-1001 A once round the review loop to released; KF-1002 stays in check', async () => {
		const states: Record<string, string> = {};
		for (const number of ['KF-1001', 'KF-1002', 'KF-1003', 'KF-2001']) {
			states[number] = (await placeOf(number)).revision.state;
		}
		expect(states).toEqual({
			'KF-1001': 'released',
			'KF-1002': 'in-check',
			'KF-1003': 'draft',
			'KF-2001': 'draft'
		});
		const housing = await placeOf('KF-1001');
		// Seeded twice (beforeAll), moved once.
		const history = await transitionsOf(database.db, housing.revision.id);
		expect(history.map((t) => `${t.name} ${t.byName}`)).toEqual([
			'submit Tomas Reyes',
			'return Priya Natarajan',
			'resubmit Tomas Reyes',
			'approve Priya Natarajan',
			'release Priya Natarajan'
		]);
		expect(history[1].message).toContain('F-5');
		// The rulebook's critical and major findings were waived, with the reason, before approval.
		const waived = (await listFindings(database.db, housing.revision.id)).filter(
			(f) => f.kind === 'rule' && (f.severity === 'critical' || f.severity === 'major')
		);
		expect(waived.map((f) => f.number)).toEqual([2, 3, 4]);
		for (const f of waived) expect(f.waiver).toMatchObject({ reason: demoWaiverReason });
		expect(await blockingFindings(database.db, housing.revision.id)).toEqual([]);
		expect(housing.revision.approvedBy).toBe(history[3].by);
		expect(housing.revision.releasedBy).toBe(history[4].by);
		// The findings were answered and resolved between the return and the resubmission.
		const trail = await database.db
			.select()
			.from(activity)
			.where(eq(activity.drawingId, housing.drawing.id))
			.orderBy(asc(activity.id));
		const steps = trail
			// The rulebook's own notes on the revision are not moves.
			.filter(
				(row) => (row.entity === 'revision' && row.action !== 'rulebook') || row.action === 'state'
			)
			.map((row) =>
				row.entity === 'revision' ? row.action : `F ${(row.after as { state: string }).state}`
			);
		expect(steps).toEqual([
			'upload',
			'submit',
			'return',
			'F answered',
			'F resolved',
			'F answered',
			'F resolved',
			'resubmit',
			'approve',
			'release'
		]);
	});
});

/** The rows of a README table between its markers: the first four cells of each. */
function readmeTable(marker: string): string[][] {
	const readme = readFileSync(join(process.cwd(), 'README.md'), 'utf8');
	const start = readme.indexOf(`<!-- ${marker}: start -->`);
	const end = readme.indexOf(`<!-- ${marker}: end -->`);
	expect(start, `README ${marker} table`).toBeGreaterThan(0);
	return readme
		.slice(start, end)
		.split('\n')
		.filter((line) => line.startsWith('|'))
		.slice(2)
		.map((line) =>
			line
				.slice(1, -1)
				.split('|')
				.map((cell) => cell.trim())
				.slice(0, 5)
		);
}

describe("the demo's rule findings on stored data", () => {
	it('are exactly the README demo table, where each drawing keeps them', async () => {
		const rows: string[][] = [];
		for (const number of ['KF-1001', 'KF-1002', 'KF-1003', 'KF-2001']) {
			const place = await placeOf(number);
			const features = new Map((await boardOf(number)).map((f) => [f.id, f.label]));
			const fits = new Map(
				(await fitsOf(database.db, place)).map((f) => [
					f.id,
					`${f.members.hole.label} / ${f.members.shaft?.label ?? f.fastener?.label ?? 'fastener'}`
				])
			);
			for (const f of await findingsOf(database.db, place, { kind: 'rule' })) {
				expect(f.state, `${number} F-${f.number}`).toBe('raised');
				rows.push([
					number,
					`F-${f.number}`,
					f.rule!,
					f.severity,
					f.fitId ? fits.get(f.fitId)! : f.featureId ? features.get(f.featureId)! : 'drawing'
				]);
			}
		}
		expect(rows).toEqual(readmeTable('stored demo findings'));
	});
});
