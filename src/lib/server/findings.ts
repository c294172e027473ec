/*
 * Findings on a revision (PRODUCT.md §3): the service behind the JSON routes and the pages'
 * form actions. Callers check that the asker may see the revision (`requireRevision`); these
 * functions check the rest — what the asker's role may do to this finding, that the feature,
 * fit and assignee exist in the team, that the machine has the move, that the revision is not
 * frozen and the version is current — and answer an outcome either way.
 */
import {
	editRefused,
	findingName,
	isOpen,
	moveNames,
	moveRefused,
	movesAllowed,
	needsMessage,
	type FindingJson,
	type FindingPowers,
	type FindingState
} from '$lib/findings';
import type { FindingInput, FindingPatch, FindingQuery } from '$lib/schemas/findings';
import { writeRefusal } from './api';
import { can } from './capabilities';
import type { Db } from './db/connect';
import type { Actor } from './db/queries/activity';
import { getFeature, listFeatures } from './db/queries/features';
import {
	createFinding,
	InvalidMove,
	listFindings,
	listMoves,
	moveFinding,
	storedFinding,
	updateFinding,
	type FindingEdit,
	type FindingValues
} from './db/queries/findings';
import { getFit } from './db/queries/fits';
import { getMembership, listMembers } from './db/queries/teams';
import { memberName, otherMemberName, type FitAnswer } from '$lib/fits';
import { roleLabels } from '$lib/roles';
import type { DrawingRow, FindingRow, RevisionRow, Role, TeamRow } from './db/schema';
import { checkLocation } from './features';

/** Where a finding sits: its team, drawing and revision. */
export interface FindingPlace {
	team: Pick<TeamRow, 'id'>;
	drawing: DrawingRow;
	revision: RevisionRow;
}

/** Who asks: the signed-in user and their role in the team. */
export interface Asker {
	user: Actor;
	role: Role;
}

export type FindingRefusal = {
	ok: false;
	status: 400 | 403 | 404 | 409;
	code: 'invalid' | 'forbidden' | 'not_found' | 'stale' | 'frozen' | 'invalid_transition';
	message: string;
	field?: string;
	current?: FindingJson;
};
export type FindingOutcome = { ok: true; finding: FindingJson } | FindingRefusal;

type Moves = Awaited<ReturnType<typeof listMoves>>;

function findingJson(row: FindingRow, moves?: Moves): FindingJson {
	return {
		...storedFinding(row),
		createdAt: row.createdAt.toISOString(),
		updatedAt: row.updatedAt.toISOString(),
		...(moves && {
			history: moves.map((m) => ({ ...m, at: m.at.toISOString() }))
		})
	};
}

/** The revision's findings matching the filters, by number. */
export async function findingsOf(db: Db, place: FindingPlace, query: FindingQuery = {}) {
	return (await listFindings(db, place.revision.id, query)).map((row) => findingJson(row));
}

/** One finding with its history of state changes. */
export async function findingOf(db: Db, row: FindingRow) {
	return findingJson(row, await listMoves(db, row.id));
}

const invalid = (field: string, message: string): FindingRefusal => ({
	ok: false,
	status: 400,
	code: 'invalid',
	message: `${field}: ${message}`,
	field
});

const forbidden = (message: string): FindingRefusal => ({
	ok: false,
	status: 403,
	code: 'forbidden',
	message
});

/** The feature and fit are of this revision, the assignee a member who may answer. */
async function checkReferences(
	db: Db,
	place: FindingPlace,
	values: Partial<Pick<FindingInput, 'featureId' | 'fitId' | 'assigneeId' | 'location'>>
): Promise<FindingRefusal | null> {
	const where = `revision ${place.revision.letter}`;
	if (values.location) {
		const bad = checkLocation(place, values.location);
		if (bad) return invalid('location', bad.message.replace(/^location: /, ''));
	}
	if (values.featureId && !(await getFeature(db, place.revision.id, values.featureId))) {
		return invalid('featureId', `no feature of ${where} has this id`);
	}
	if (values.fitId && !(await getFit(db, place.revision.id, values.fitId))) {
		return invalid('fitId', `no fit listed on ${where} has this id`);
	}
	if (values.assigneeId) {
		const member = await getMembership(db, place.team.id, values.assigneeId);
		if (!member) return invalid('assigneeId', 'not a member of this team');
		if (!can(member.role, 'answerFindings')) {
			return invalid(
				'assigneeId',
				`this member's role (${roleLabels[member.role]}) does not answer findings`
			);
		}
	}
	return null;
}

async function refusalFor(db: Db, err: unknown): Promise<FindingRefusal> {
	if (err instanceof InvalidMove) {
		return {
			ok: false,
			status: 409,
			code: 'invalid_transition',
			message: `${err.message}.`,
			current: await findingOf(db, err.current)
		};
	}
	return writeRefusal(err, 'finding', (row: FindingRow) => findingOf(db, row));
}

/** Raises a manual finding with the drawing's next number. */
export async function raiseFinding(
	db: Db,
	actor: Actor,
	place: FindingPlace,
	input: FindingInput
): Promise<FindingOutcome> {
	const bad = await checkReferences(db, place, input);
	if (bad) return bad;
	try {
		const row = await createFinding(db, actor, place.drawing, place.revision, {
			...input,
			kind: 'manual'
		});
		return { ok: true, finding: await findingOf(db, row) };
	} catch (err) {
		return refusalFor(db, err);
	}
}

/** What the asker's role gives them on findings (`$lib/findings` judges with it). */
export function powersOf(asker: Asker): FindingPowers {
	return {
		userId: asker.user.id,
		role: asker.role,
		raise: can(asker.role, 'raiseFindings'),
		answer: can(asker.role, 'answerFindings'),
		judge: can(asker.role, 'judgeFindings')
	};
}

/** What the asker's role allows on this finding: a refusal, or null when the move is theirs. */
function moveRefusal(asker: Asker, finding: FindingRow, to: FindingState): FindingRefusal | null {
	const refused = moveRefused(powersOf(asker), finding, to);
	return refused ? forbidden(refused) : null;
}

/** The states the asker may move this finding to now: their role allows it and the machine has it. */
export function movesFor(asker: Asker, finding: FindingRow): FindingState[] {
	return movesAllowed(powersOf(asker), finding);
}

type Write = (changes: Partial<FindingValues>, action?: FindingEdit) => Promise<FindingRow>;

/** A state change: the asker's role may make it and a message says why where one is needed. */
async function move(
	db: Db,
	asker: Asker,
	place: FindingPlace,
	finding: FindingRow,
	patch: FindingPatch & { state: FindingState }
) {
	const refused = moveRefusal(asker, finding, patch.state);
	if (refused) return refused;
	if (needsMessage.includes(patch.state) && !patch.message) {
		return invalid(
			'message',
			`Say why you ${moveNames[patch.state]} ${findingName(finding.number)}`
		);
	}
	const { drawing, revision } = place;
	const message = patch.message ?? '';
	return moveFinding(
		db,
		asker.user,
		drawing,
		revision,
		finding,
		patch.version,
		patch.state,
		message
	);
}

/** A waiver on an open rule finding, or taking it back (`null`): a judge's decision. */
async function waive(
	db: Db,
	asker: Asker,
	finding: FindingRow,
	waiver: { reason: string } | null,
	write: Write
) {
	if (!can(asker.role, 'judgeFindings')) {
		return forbidden(`Your role (${roleLabels[asker.role]}) does not waive findings`);
	}
	if (finding.kind !== 'rule' || !isOpen(finding.state)) {
		return {
			ok: false,
			status: 409,
			code: 'invalid_transition',
			message: 'Only an open rule finding is waived: a manual finding is withdrawn instead',
			current: await findingOf(db, finding)
		} satisfies FindingRefusal;
	}
	const value = waiver && {
		by: asker.user.id,
		at: new Date().toISOString(),
		reason: waiver.reason
	};
	return write({ waiver: value }, waiver ? 'waive' : 'unwaive');
}

/** An edit of the fields: by whoever raised it or a judge; the rulebook's own text stays. */
async function edit(
	db: Db,
	asker: Asker,
	place: FindingPlace,
	finding: FindingRow,
	changes: Partial<FindingValues>,
	write: Write
) {
	const refused = editRefused(powersOf(asker), finding);
	if (refused) return forbidden(refused);
	if (finding.kind === 'rule' && changes.text !== undefined) {
		return invalid('text', "A rule finding's text is the rulebook's");
	}
	const bad = await checkReferences(db, place, changes);
	return bad ?? write(changes);
}

/**
 * PATCH …/findings/{id}: a state change, a waiver, or an edit of the fields, each checked
 * against what the asker's role may do.
 */
export async function changeFinding(
	db: Db,
	asker: Asker,
	place: FindingPlace,
	finding: FindingRow,
	patch: FindingPatch
): Promise<FindingOutcome> {
	const { version, state, message: _message, waiver, ...changes } = patch;
	const write: Write = (values, action) =>
		updateFinding(db, asker.user, place.drawing, place.revision, finding, version, values, action);
	try {
		const done =
			state !== undefined
				? await move(db, asker, place, finding, { ...patch, state })
				: waiver !== undefined
					? await waive(db, asker, finding, waiver, write)
					: await edit(db, asker, place, finding, changes, write);
		if ('ok' in done) return done;
		return { ok: true, finding: await findingOf(db, done) };
	} catch (err) {
		return refusalFor(db, err);
	}
}

/**
 * What a new finding's fields offer on this revision (the findings page and the board): the
 * team's members (those who may answer are offered as assignee), the revision's features and
 * the fits listed on it, each named as people read them.
 */
export async function findingChoices(
	db: Db,
	place: FindingPlace,
	fits: Pick<FitAnswer, 'id' | 'members' | 'fastener'>[]
) {
	const [members, features] = await Promise.all([
		listMembers(db, place.team.id),
		listFeatures(db, place.revision.id)
	]);
	return {
		members: members.map((m) => ({
			userId: m.userId,
			name: m.name ?? m.email,
			mayAnswer: can(m.role, 'answerFindings')
		})),
		features: features.map((f) => ({ id: f.id, balloon: f.balloon, label: f.label })),
		fits: fits.map((f) => ({
			id: f.id,
			name: `${memberName(f.members.hole)} with ${otherMemberName(f)}`
		}))
	};
}
