import { eq } from 'drizzle-orm';
import { featureInput } from '$lib/schemas/features';
import { findingInput, findingPatch } from '$lib/schemas/findings';
import type { Db } from '../db/connect';
import {
	createDrawing,
	DrawingNumberTaken,
	getDrawing,
	getRevision,
	latestRevision
} from '../db/queries/drawings';
import { importFeatures, type FeaturePlace } from '../features';
import { addFit } from '../fits';
import { addComment, findingThread } from '../comments';
import { getFinding } from '../db/queries/findings';
import { changeFinding, raiseFinding } from '../findings';
import { fitCreate } from '$lib/schemas/fits';
import { addMember, getTeamBySlug } from '../db/queries/teams';
import type { Storage } from '../storage';
import { storeRevisionBytes } from '../uploads';
import { demoDrawingPdf, demoDrawings } from './drawings';
import { demoPeople } from './people';
import { demoReviews, pumpAssembly } from './review';
import { demoFindings, type DemoFinding, type DemoPerson } from './findings';
import { demoMovesAfter, demoMovesBefore, demoWaiverReason, type DemoMove } from './review-loop';
import { blockingFindings } from '../db/queries/findings';
import { transitionRevision } from '../transitions';
import { transitionInput } from '$lib/schemas/transitions';
import { createUser, getUserByEmail } from '../db/queries/users';
import { drawings, teams, type Role, type TeamRow, type UserRow } from '../db/schema';
import { hashPassword } from '../passwords';

/** The invented Kestrel Fluidics demo: created once, never overwritten. */
export async function seedDemo(db: Db, password: string, storage: Storage, tempDir: string) {
	const passwordHash = await hashPassword(password);
	const people: { user: UserRow; role: Role }[] = [];
	for (const person of demoPeople) {
		// Another instance starting at the same time may create the user between our two calls.
		const user =
			(await getUserByEmail(db, person.email)) ??
			(await createUser(db, {
				name: person.name,
				email: person.email,
				passwordHash,
				emailVerified: new Date()
			})) ??
			(await getUserByEmail(db, person.email));
		if (user) people.push({ user, role: person.role });
	}
	// One transaction, so an instance that loses the race never sees the team without members.
	if (!(await getTeamBySlug(db, 'kestrel')))
		await db.transaction(async (tx) => {
			const [team] = await tx
				.insert(teams)
				.values({ slug: 'kestrel', name: 'Kestrel Fluidics' })
				.onConflictDoNothing()
				.returning();
			if (!team) return;
			for (const { user, role } of people) await addMember(tx, null, team.id, user, role);
		});
	const team = await getTeamBySlug(db, 'kestrel');
	const drafter = people.find((p) => p.role === 'drafter')?.user;
	const checker = people.find((p) => p.role === 'checker')?.user;
	if (team && drafter && checker) {
		await seedDrawings(db, storage, tempDir, team.id, drafter);
		const seeded = await seedFeatures(db, team, drafter);
		await seedFits(db, team, drafter, seeded);
		await seedMoves(db, team, { checker, drafter }, seeded, demoMovesBefore);
		await seedFindings(db, team, { checker, drafter }, seeded);
		await seedMoves(db, team, { checker, drafter }, seeded, demoMovesAfter);
	}
}

/** The four Kestrel drawings, each with revision A as a generated vector PDF. */
async function seedDrawings(
	db: Db,
	storage: Storage,
	tempDir: string,
	teamId: string,
	drafter: UserRow
) {
	for (const demo of demoDrawings) {
		let drawing = await getDrawing(db, teamId, demo.number);
		if (!drawing) {
			try {
				drawing = await createDrawing(db, drafter, teamId, {
					number: demo.number,
					title: demo.title,
					partName: demo.partName,
					material: demo.material,
					units: demo.units,
					standard: demo.standard,
					generalTolerance: demo.generalTolerance,
					notes: demo.notes
				});
			} catch (err) {
				// Another instance seeded it first.
				if (!(err instanceof DrawingNumberTaken)) throw err;
				drawing = await getDrawing(db, teamId, demo.number);
			}
		}
		if (!drawing || (await latestRevision(db, drawing.id))) continue;
		const pdf = await demoDrawingPdf(demo.number);
		const stored = await storeRevisionBytes(
			db,
			storage,
			drafter,
			drawing,
			pdf,
			{
				letter: 'A',
				reason: 'First issue for review'
			},
			tempDir
		);
		if (!stored.ok && stored.code !== 'conflict' && stored.code !== 'duplicate_revision') {
			throw new Error(`Demo drawing ${demo.number} was refused: ${stored.message}`);
		}
	}
}

/**
 * The demo's features on revision A of each drawing, each placed where the generator drew its
 * callout; a datum letter that no feature of size defines becomes a plain face at its datum
 * symbol. Only on a drawing where no balloon was ever given, so nothing is added twice.
 */
async function seedFeatures(db: Db, team: TeamRow, drafter: UserRow) {
	/** The rulebook fixture's feature ids → the features stored now, with their places. */
	const seeded = new Map<string, { id: string; place: FeaturePlace }>();
	for (const demo of demoDrawings) {
		const review = demoReviews.find((r) => r.number === demo.number);
		if (!review) continue;
		await db.transaction(async (tx) => {
			const found = await getDrawing(tx, team.id, demo.number);
			if (!found) return;
			// Locked, so a second instance seeding at the same time waits and then finds balloons.
			const [drawing] = await tx
				.select()
				.from(drawings)
				.where(eq(drawings.id, found.id))
				.for('update');
			const revision = await getRevision(tx, drawing.id, 'A');
			if (!revision || drawing.nextBalloon !== 1) return;
			const place = { team, drawing, revision };
			// A balloon sits just right of its callout, as a checker places one, not on the text.
			const at = (kind: string, text: string) => {
				const c = demo.callouts.find((c) => c.kind === kind && c.text === text);
				return c ? { sheet: c.sheet, x: Math.min(1, c.x + c.w / 2 + 0.014), y: c.y } : null;
			};
			const defined = new Set(review.features.map((f) => f.datumFeature).filter(Boolean));
			const faces = (review.drawing.datums ?? []).filter((letter) => !defined.has(letter));
			const inputs = [
				...review.features.map((f) => ({
					label: f.label,
					kind: f.kind,
					internal: f.internal,
					boughtOut: f.boughtOut ?? false,
					callout: f.callout,
					quantity: f.quantity ?? undefined,
					controls: f.controls,
					overrides: f.overrides,
					datumFeature: f.datumFeature ?? null,
					notes: f.notes,
					location: at('size', f.callout)
				})),
				...faces.map((letter) => {
					const symbol = demo.callouts.find((c) => c.kind === 'datum' && c.text === letter);
					const words = symbol?.label.replace(/^Datum \w+: /, '') ?? `datum ${letter}`;
					return {
						label: words.charAt(0).toUpperCase() + words.slice(1),
						kind: 'other' as const,
						datumFeature: letter,
						location: at('datum', letter)
					};
				})
			];
			// All at once, so the rulebook judges the drawing once with every datum defined.
			const rows = inputs.map((input, i) => ({ line: i + 1, input: featureInput.parse(input) }));
			const added = await importFeatures(tx, drafter, place, rows, []);
			if (!added.ok) throw new Error(`Demo features on ${demo.number}: ${added.message}`);
			for (const [i, feature] of added.features.entries()) {
				const fixtureId = review.features[i]?.id;
				if (fixtureId) seeded.set(fixtureId, { id: feature.id, place });
			}
		});
	}
	return seeded;
}

/**
 * The demo's fits (PRODUCT.md §8) as the rulebook fixture describes them: the pump's fits across
 * the three metric drawings and the bracket's pivot. Only between features seeded in this run,
 * so a restart adds nothing twice.
 */
async function seedFits(
	db: Db,
	team: TeamRow,
	drafter: UserRow,
	seeded: Map<string, { id: string; place: FeaturePlace }>
) {
	const fits = [...pumpAssembly.fits, ...demoReviews.flatMap((r) => r.fits)];
	for (const fit of fits) {
		const hole = seeded.get(fit.holeFeatureId);
		const shaft = fit.shaftFeatureId ? seeded.get(fit.shaftFeatureId) : undefined;
		if (!hole || (fit.shaftFeatureId && !shaft)) continue;
		const added = await addFit(
			db,
			drafter,
			{ ...hole.place, team },
			fitCreate.parse({
				holeFeatureId: hole.id,
				shaftFeatureId: shaft?.id ?? null,
				fastener: fit.fastener ? { ...fit.fastener, label: fit.fastener.label ?? '' } : null,
				intent: fit.intent,
				sharedDatumFrame: fit.sharedDatumFrame ?? false,
				requiredMinClearance: fit.requiredMinClearance ?? null,
				requiredMaxClearance: fit.requiredMaxClearance ?? null,
				temperature: fit.temperature ?? null
			})
		);
		if (!added.ok) throw new Error(`Demo fit ${fit.id}: ${added.message}`);
	}
}

/** Where a demo finding points: beside its callout, or an area starting near it. */
function demoLocation(finding: DemoFinding) {
	const demo = demoDrawings.find((d) => d.number === finding.drawing);
	const c = demo?.callouts.find((c) => c.kind === finding.at.kind && c.text === finding.at.text);
	if (!c) return null;
	const { area } = finding.at;
	// A point finding sits just left of its callout (the feature's balloon is on the right).
	if (!area) return { sheet: c.sheet, x: Math.max(0, c.x - c.w / 2 - 0.014), y: c.y };
	const x = Math.max(0, c.x - 0.02);
	const y = Math.max(0, c.y - area.h / 2);
	return { sheet: c.sheet, x, y, w: Math.min(area.w, 1 - x), h: Math.min(area.h, 1 - y) };
}

/**
 * The demo checker's manual findings and their threads with the drafter (demo/findings.ts),
 * on the drawings whose features were seeded in this run and which have no finding yet.
 */
async function seedFindings(
	db: Db,
	team: TeamRow,
	people: Record<DemoPerson, UserRow>,
	seeded: Map<string, { id: string; place: FeaturePlace }>
) {
	const places = new Map(
		[...seeded.values()].map((s) => [s.place.drawing.number, { ...s.place, team }])
	);
	for (const demo of demoFindings) {
		const place = places.get(demo.drawing);
		if (!place) continue;
		const raised = await raiseFinding(
			db,
			people.checker,
			place,
			findingInput.parse({
				text: demo.text,
				severity: demo.severity,
				featureId: demo.feature ? (seeded.get(demo.feature)?.id ?? null) : null,
				assigneeId: demo.assignDrafter ? people.drafter.id : null,
				location: demoLocation(demo)
			})
		);
		if (!raised.ok) throw new Error(`Demo finding on ${demo.drawing}: ${raised.message}`);
		let finding = (await getFinding(db, place.revision.id, raised.finding.id))!;
		for (const step of demo.steps) {
			const asker = { user: people[step.by], role: step.by };
			const done =
				'comment' in step
					? await addComment(db, asker, findingThread(place, finding), step.comment)
					: await changeFinding(
							db,
							asker,
							place,
							finding,
							findingPatch.parse({
								state: step.to,
								message: step.message,
								version: finding.version
							})
						);
			if (!done.ok) throw new Error(`Demo thread on ${demo.drawing}: ${done.message}`);
			finding = (await getFinding(db, place.revision.id, finding.id))!;
		}
	}
}

/**
 * The demo's review loop (demo/review-loop.ts) through the same moves a person makes, on the
 * drawings whose features were seeded in this run.
 */
async function seedMoves(
	db: Db,
	team: TeamRow,
	people: Record<DemoPerson, UserRow>,
	seeded: Map<string, { id: string; place: FeaturePlace }>,
	moves: DemoMove[]
) {
	const places = new Map(
		[...seeded.values()].map((s) => [s.place.drawing.number, { ...s.place, team }])
	);
	for (const move of moves) {
		const place = places.get(move.drawing);
		if (!place) continue;
		if (move.to === 'approved') {
			const judge = { user: people[move.by], role: move.by };
			for (const finding of await blockingFindings(db, place.revision.id)) {
				const waived = await changeFinding(db, judge, place, finding, {
					version: finding.version,
					waiver: { reason: demoWaiverReason }
				});
				if (!waived.ok) throw new Error(`Demo waiver on ${move.drawing}: ${waived.message}`);
			}
		}
		const done = await transitionRevision(
			db,
			{ user: people[move.by], role: move.by },
			place,
			transitionInput.parse({ to: move.to, message: move.message })
		);
		if (!done.ok) throw new Error(`Demo move of ${move.drawing} to ${move.to}: ${done.message}`);
	}
}
