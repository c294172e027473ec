import type { Db } from '../db/connect';
import {
	createDrawing,
	DrawingNumberTaken,
	getDrawing,
	latestRevision
} from '../db/queries/drawings';
import { addMember, getTeamBySlug } from '../db/queries/teams';
import type { Storage } from '../storage';
import { storeRevisionBytes } from '../uploads';
import { demoDrawingPdf, demoDrawings } from './drawings';
import { demoPeople } from './people';
import { createUser, getUserByEmail } from '../db/queries/users';
import { teams, type Role, type UserRow } from '../db/schema';
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
	if (team && drafter) await seedDrawings(db, storage, tempDir, team.id, drafter);
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
