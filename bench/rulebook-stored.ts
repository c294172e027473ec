// The rulebook on stored data: 5,000 features and 2,000 fits in one revision. One feature edit
// (the write, its trail entry and the in-transaction re-check of what it touches) and a full
// check through the database, next to the core alone on the same data in the same run, on PGlite
// and, when installed, on a PostgreSQL server. Run: npm run bench:rulebook-stored
// (POSTGRES_BIN=/usr/local/bin where the server's binaries are not under /usr/lib/postgresql).
// Prints figures, then one line of JSON (ms); editMs and fullMs are PGlite's.
import { eq } from 'drizzle-orm';
import { findPostgresBin, startPostgres } from '../scripts/postgres.js';
import { openPglite, openPostgres, type Database } from '../src/lib/server/db/connect';
import { createDrawing, insertRevision } from '../src/lib/server/db/queries/drawings';
import { updateFeature } from '../src/lib/server/db/queries/features';
import { recheckRevision } from '../src/lib/server/db/queries/rule-findings';
import { createTeam } from '../src/lib/server/db/queries/teams';
import { createUser } from '../src/lib/server/db/queries/users';
import { features, findings, fits, type FeatureRow } from '../src/lib/server/db/schema';
import {
	evaluate,
	indexRulebook,
	type RulebookDrawing,
	type RulebookFeature,
	type RulebookFit
} from '../src/lib/tolerance/rulebook';

const FEATURES = Number(process.env.BENCH_FEATURES || 5000);
const FITS = 2000;
const EDITS = Number(process.env.BENCH_EDITS || 30);
const FULL_RUNS = Number(process.env.BENCH_RUNS || 3);

const median = (values: number[]) => {
	const sorted = [...values].sort((a, b) => a - b);
	return sorted[Math.floor((sorted.length - 1) / 2)];
};
const ms = (value: number) => Math.round(value * 100) / 100;
const now = () => performance.now();

/**
 * Feature i: fit pairs first (hole, shaft; Ⓔ and a zero position at MMC, as a careful drawing
 * has them), then plain sizes; one pair in ten and one size in ten carry a deliberate mistake,
 * so the drawing has findings of several rules (ENV-02, FIT-01, LIM-01, LIM-04).
 */
function featureValues(i: number) {
	const d = 3 + (i % 97);
	if (i < FITS * 2) {
		const hole = i % 2 === 0;
		const pair = i >> 1;
		const callout = hole
			? `Ø${d} H7${pair % 10 === 0 ? '' : ' Ⓔ'}`
			: `Ø${d} ${pair % 10 === 5 ? 'h6' : 'g6'} Ⓔ`;
		return {
			kind: hole ? ('bore' as const) : ('shaft' as const),
			internal: hole,
			label: `${hole ? 'Bore' : 'Shaft'} ${i}`,
			callout,
			controls: [
				{
					characteristic: 'position' as const,
					value: '0',
					diameterZone: true,
					appliesTo: 'median' as const,
					modifier: 'mmc' as const,
					datums: ['A']
				}
			]
		};
	}
	const faults = [
		{ kind: 'slot' as const, internal: true, callout: `(${d})` },
		{ kind: 'pin' as const, internal: false, callout: `Ø${d} H7` }
	];
	const plain = [
		{ kind: 'width' as const, internal: false, callout: `${d} ±0.1` },
		{ kind: 'hole' as const, internal: true, callout: `Ø${d}.5 +0.05/0` }
	];
	const which = i % 10 === 0 ? faults[(i / 10) % 2] : plain[i % 2];
	return { ...which, label: `Size ${i}`, controls: [] };
}

async function seed(database: Database) {
	const { db } = database;
	const actor = (await createUser(db, {
		name: 'Bench',
		email: 'bench@example.test',
		passwordHash: null
	}))!;
	const team = await createTeam(db, actor, { slug: 'bench', name: 'Bench' });
	const drawing = await createDrawing(db, actor, team.id, {
		number: 'B-1',
		title: 'Bench',
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm' }
	});
	const revision = await insertRevision(db, actor, drawing, {
		letter: 'A',
		pages: 1,
		sheets: [{ width: 1190.55, height: 841.89 }],
		sha256: 'b'.repeat(64),
		size: 1000,
		storageKey: 'bench/B-1-A.pdf'
	});
	// Stored directly in bulk: the setup is not what is measured.
	const rows: (typeof features.$inferInsert)[] = [
		{
			revisionId: revision.id,
			drawingId: drawing.id,
			balloon: 1,
			kind: 'other',
			internal: false,
			callout: '',
			datumFeature: 'A',
			label: 'Datum A'
		}
	];
	for (let i = 0; i < FEATURES; i++)
		rows.push({
			revisionId: revision.id,
			drawingId: drawing.id,
			balloon: i + 2,
			...featureValues(i)
		});
	const stored: FeatureRow[] = [];
	for (let i = 0; i < rows.length; i += 500)
		stored.push(
			...(await db
				.insert(features)
				.values(rows.slice(i, i + 500))
				.returning())
		);
	const sized = stored.slice(1);
	const fitRows = [];
	for (let i = 0; i < FITS; i++) {
		fitRows.push({
			teamId: team.id,
			revisionId: revision.id,
			holeFeatureId: sized[2 * i].id,
			shaftFeatureId: sized[2 * i + 1].id,
			intent: 'running' as const
		});
	}
	for (let i = 0; i < fitRows.length; i += 500)
		await db.insert(fits).values(fitRows.slice(i, i + 500));
	return { actor, drawing, revision, sized };
}

/** The same data as plain rulebook input, for the core alone. */
async function coreInput(database: Database, revisionId: string) {
	const rows = await database.db.select().from(features).where(eq(features.revisionId, revisionId));
	const fitRows = await database.db.select().from(fits).where(eq(fits.revisionId, revisionId));
	const drawing: RulebookDrawing = {
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: { kind: 'iso2768', linear: 'm' },
		notes: '',
		datums: ['A']
	};
	const list: RulebookFeature[] = rows
		.filter((r) => r.callout)
		.map((r) => ({
			id: r.id,
			kind: r.kind,
			internal: r.internal,
			callout: r.callout,
			label: r.label,
			controls: r.controls,
			overrides: r.overrides,
			quantity: r.quantity
		}));
	const fitList: RulebookFit[] = fitRows.map((f) => ({
		id: f.id,
		holeFeatureId: f.holeFeatureId,
		shaftFeatureId: f.shaftFeatureId,
		intent: f.intent
	}));
	return { drawing, features: list, fits: fitList };
}

async function measure(name: string, database: Database) {
	const { actor, drawing, revision, sized } = await seed(database);
	const { db } = database;

	let t = now();
	await db.transaction((tx) => recheckRevision(tx, actor, revision.id, 'full'));
	const fullFirst = now() - t;
	const count = await db.$count(findings, eq(findings.revisionId, revision.id));

	const fullRuns: number[] = [];
	for (let i = 0; i < FULL_RUNS; i++) {
		t = now();
		await db.transaction((tx) => recheckRevision(tx, actor, revision.id, 'full'));
		fullRuns.push(now() - t);
	}

	// Edits of hole members of fits: each flips its callout between limits that disagree with its
	// class (LIM-04) and the class alone, so every edit raises or resolves a finding.
	const editRuns: number[] = [];
	const recheckRuns: number[] = [];
	for (let i = 0; i < EDITS; i++) {
		const target = sized[(i * 2 * 37) % (FITS * 2)];
		const [current] = await db.select().from(features).where(eq(features.id, target.id));
		const callout = i % 2 === 0 ? 'Ø25 H7 (25.000/25.025) Ⓔ' : 'Ø25 H7 Ⓔ';
		t = now();
		await updateFeature(db, actor, drawing, revision, current, current.version, { callout });
		editRuns.push(now() - t);
		t = now();
		await db.transaction((tx) =>
			recheckRevision(tx, actor, revision.id, { featureIds: [target.id] })
		);
		recheckRuns.push(now() - t);
	}

	// The core alone on the same data, in the same run.
	const input = await coreInput(database, revision.id);
	const coreFull: number[] = [];
	for (let i = 0; i < FULL_RUNS; i++) {
		t = now();
		evaluate(input);
		coreFull.push(now() - t);
	}
	const index = indexRulebook(input.features, input.fits);
	const coreEdit: number[] = [];
	for (let i = 0; i < EDITS; i++) {
		const id = sized[(i * 2 * 37) % (FITS * 2)].id;
		t = now();
		evaluate({ ...input, index, only: { featureIds: [id] } });
		coreEdit.push(now() - t);
	}
	const figures = {
		name,
		findings: count,
		fullFirstMs: ms(fullFirst),
		fullMs: ms(median(fullRuns)),
		editMs: ms(median(editRuns)),
		editMaxMs: ms(Math.max(...editRuns)),
		recheckMs: ms(median(recheckRuns)),
		coreFullMs: ms(median(coreFull)),
		coreEditMs: ms(median(coreEdit))
	};
	console.log(
		`${name}: ${FEATURES.toLocaleString('en')} features, ${FITS.toLocaleString('en')} fits, ${count} rule findings\n` +
			`  full check, first (raises every finding)  ${figures.fullFirstMs} ms\n` +
			`  full check, again (median of ${FULL_RUNS})         ${figures.fullMs} ms   (target ≤ 2000; core alone ${figures.coreFullMs} ms)\n` +
			`  one feature edit with its re-check        ${figures.editMs} ms   (median of ${EDITS}, max ${figures.editMaxMs}; target ≤ 50)\n` +
			`  its re-check alone                        ${figures.recheckMs} ms   (core alone ${figures.coreEditMs} ms)`
	);
	return figures;
}

const pglite = await openPglite(null);
await pglite.migrate();
const onPglite = await measure('PGlite (in memory)', pglite);
await pglite.close();

let onPostgres: Awaited<ReturnType<typeof measure>> | null = null;
if (!findPostgresBin()) {
	console.log('!! PostgreSQL not found (set POSTGRES_BIN=/usr/local/bin): PGlite only');
} else {
	const server = await startPostgres();
	try {
		const postgres = await openPostgres(server.url);
		await postgres.migrate();
		onPostgres = await measure('PostgreSQL (local server)', postgres);
		await postgres.close();
	} finally {
		server.stop();
	}
}

console.log(
	JSON.stringify({
		editMs: onPglite.editMs,
		fullMs: onPglite.fullMs,
		fullFirstMs: onPglite.fullFirstMs,
		recheckMs: onPglite.recheckMs,
		coreEditMs: onPglite.coreEditMs,
		coreFullMs: onPglite.coreFullMs,
		findings: onPglite.findings,
		...(onPostgres && {
			postgres: {
				editMs: onPostgres.editMs,
				fullMs: onPostgres.fullMs,
				fullFirstMs: onPostgres.fullFirstMs,
				recheckMs: onPostgres.recheckMs,
				coreEditMs: onPostgres.coreEditMs,
				coreFullMs: onPostgres.coreFullMs
			}
		})
	})
);
