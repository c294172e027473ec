/*
 * Fits between features (PRODUCT.md §4 per fit, §6): the service behind the JSON routes.
 * A fit belongs to the revision of its hole (or clearance hole); the other member is a feature
 * of any drawing's revision in the same team, or a bought fastener. Each member is computed
 * under its own revision's settings (units, standard, general tolerance) and its drawing's
 * notes, through the core's per-member drawing context; the answer uses the calc API's fit JSON.
 */
import { fitJson } from '$lib/calc-api';
import { fitDiagramSvg } from '$lib/tolerance/fit-diagram';
import type { FitCreate, FitPatch } from '$lib/schemas/fits';
import {
	evaluateFit,
	type FitIntent,
	type FitMemberInput,
	type FitResult
} from '$lib/tolerance/fit';
import type { FitClassification } from '$lib/tolerance/iso286';
import { sizeFindings } from '$lib/tolerance/rulebook';
import { writeRefusal } from './api';
import type { Db } from './db/connect';
import type { Actor } from './db/queries/activity';
import { isVisibleToSuppliers } from './db/queries/drawings';
import {
	createFit,
	deleteFit,
	listFits,
	placedFeatures,
	storedFit,
	updateFit,
	type PlacedFeature
} from './db/queries/fits';
import type { DrawingRow, FitRow, RevisionRow, TeamRow } from './db/schema';

/** The revision a fit is asked about, and its team. */
export interface FitPlace {
	team: Pick<TeamRow, 'id' | 'settings'>;
	drawing: DrawingRow;
	revision: RevisionRow;
	/** The asker sees released revisions only (supplier quality). */
	releasedOnly?: boolean;
}

export type FitRefusal = {
	ok: false;
	status: 400 | 404 | 409;
	code: 'invalid' | 'not_found' | 'stale' | 'frozen' | 'not_owner';
	message: string;
	field?: string;
	position?: number;
	current?: FitJson | null;
};

/** The stored fit with the computed values under the calc API's names. */
export type FitJson = Omit<ReturnType<typeof storedFit>, 'fastener' | 'temperature'> & {
	fastener: (FitRow['fastener'] & { size?: unknown }) | null;
	temperature:
		| (NonNullable<FitRow['temperature']> & {
				minClearance?: unknown;
				maxClearance?: unknown;
				classification?: unknown;
				checks?: unknown;
		  })
		| null;
	createdAt: string;
	updatedAt: string;
	/** True on the hole's revision, where the fit is changed; false where it is only listed. */
	owned: boolean;
	members: { hole: MemberRef; shaft: MemberRef | null; fixedHole: MemberRef | null };
	problem: { message: string; member: string; field: string; position: number | null } | null;
} & Partial<Record<string, unknown>>;

interface MemberRef {
	featureId: string;
	drawing: string;
	letter: string;
	balloon: number;
	label: string;
	callout: string;
}

const ref = (p: PlacedFeature): MemberRef => ({
	featureId: p.feature.id,
	drawing: p.drawing.number,
	letter: p.revision.letter,
	balloon: p.feature.balloon,
	label: p.feature.label,
	callout: p.feature.callout
});

const describe = (p: PlacedFeature) =>
	`${p.drawing.number} ${p.revision.letter} #${p.feature.balloon}${p.feature.label ? ` (${p.feature.label})` : ''}`;

const notesOf = (p: PlacedFeature) =>
	[p.drawing.notes, p.feature.notes].filter(Boolean).join('\n') || undefined;

/** A member as the core takes it: on its own drawing, under its own revision's settings. */
function memberInput(p: PlacedFeature): FitMemberInput {
	const { settings } = p.revision;
	return {
		callout: p.feature.callout,
		units: settings.units,
		controls: p.feature.controls,
		overrides: p.feature.overrides,
		notes: notesOf(p),
		drawing: {
			units: settings.units,
			standard: settings.standard,
			generalTolerance: settings.generalTolerance
		}
	};
}

function memberFindings(p: PlacedFeature) {
	const { settings } = p.revision;
	return sizeFindings(
		{
			callout: p.feature.callout,
			internal: p.feature.internal,
			controls: p.feature.controls,
			overrides: p.feature.overrides,
			notes: notesOf(p)
		},
		{ ...settings, notes: p.drawing.notes }
	);
}

type Members = {
	hole: PlacedFeature;
	shaft: PlacedFeature | null;
	fixedHole: PlacedFeature | null;
};

/** What the computation reads of a fit, stored or about to be. */
interface FitTerms {
	fastener?: FitRow['fastener'];
	intent?: FitRow['intent'] | null;
	sharedDatumFrame?: boolean;
	requiredMinClearance?: string | null;
	requiredMaxClearance?: string | null;
	temperature?: FitRow['temperature'];
}

function evaluation(values: FitTerms, m: Members): FitResult {
	const { settings } = m.hole.revision;
	const { label: _label, ...fastener } = values.fastener ?? { label: '', callout: '' };
	return evaluateFit({
		hole: memberInput(m.hole),
		shaft: m.shaft ? memberInput(m.shaft) : undefined,
		fastener: values.fastener ? { ...fastener, units: settings.units } : undefined,
		fixedHole: m.fixedHole ? memberInput(m.fixedHole) : undefined,
		units: settings.units,
		standard: settings.standard,
		generalTolerance: settings.generalTolerance,
		intent: values.intent ?? undefined,
		sharedDatumFrame: values.sharedDatumFrame ?? false,
		requiredMinClearance: values.requiredMinClearance ?? undefined,
		requiredMaxClearance: values.requiredMaxClearance ?? undefined,
		temperature: values.temperature ?? undefined
	});
}

function fitAnswer(place: FitPlace, row: FitRow, m: Members): FitJson {
	const base = {
		...storedFit(row),
		createdAt: row.createdAt.toISOString(),
		updatedAt: row.updatedAt.toISOString(),
		owned: row.revisionId === place.revision.id,
		members: {
			hole: ref(m.hole),
			shaft: m.shaft ? ref(m.shaft) : null,
			fixedHole: m.fixedHole ? ref(m.fixedHole) : null
		}
	};
	const result = evaluation(row, m);
	if (!result.ok) {
		return {
			...base,
			problem: {
				message: result.message,
				member: result.member,
				field: result.field,
				position: result.position
			}
		};
	}
	const computed = fitJson(result, {
		hole: memberFindings(m.hole),
		shaft: m.shaft ? memberFindings(m.shaft) : []
	});
	const {
		intent: _intent,
		temperature: thermal,
		sharedDatumFrame: _shared,
		fastener: fastenerSize,
		...values
	} = computed as typeof computed & { fastener?: Record<string, unknown> };
	return {
		...values,
		...base,
		// The stored fastener `{callout, label}` with its computed size beside it.
		fastener: row.fastener ? { ...row.fastener, size: fastenerSize ?? null } : null,
		temperature: row.temperature ? { ...row.temperature, ...thermal } : null,
		// Our own SVG (every text escaped): the zones to scale against the zero line.
		diagramSvg: fitDiagramSvg(result),
		problem: null
	};
}

async function membersOf(db: Db, teamId: string, rows: FitRow[]) {
	const ids = rows.flatMap((r) =>
		[r.holeFeatureId, r.shaftFeatureId, r.fixedHoleFeatureId].filter((id): id is string => !!id)
	);
	const placed = await placedFeatures(db, teamId, ids);
	return (row: FitRow): Members => ({
		hole: placed.get(row.holeFeatureId)!,
		shaft: row.shaftFeatureId ? placed.get(row.shaftFeatureId)! : null,
		fixedHole: row.fixedHoleFeatureId ? placed.get(row.fixedHoleFeatureId)! : null
	});
}

/** Fits listed on the revision: those of its holes, then those whose shaft sits on it. */
export async function fitsOf(db: Db, place: FitPlace) {
	const rows = await listFits(db, place.revision.id);
	const members = await membersOf(db, place.team.id, rows);
	return rows
		.filter((row) => visible(place, members(row)))
		.map((row) => fitAnswer(place, row, members(row)));
}

export async function fitOf(db: Db, place: FitPlace, row: FitRow) {
	const members = await membersOf(db, place.team.id, [row]);
	return fitAnswer(place, row, members(row));
}

/** The fit as the asker may see it, or null when one of its members is hidden from them. */
export async function visibleFitOf(db: Db, place: FitPlace, row: FitRow) {
	const members = (await membersOf(db, place.team.id, [row]))(row);
	return visible(place, members) ? fitAnswer(place, row, members) : null;
}

/**
 * Someone who reads released revisions only sees a fit only when every member's revision is
 * released (or superseded): the answer names the other members and their limits.
 */
function visible(place: FitPlace, m: Members) {
	if (!place.releasedOnly) return true;
	return [m.hole, m.shaft, m.fixedHole].every(
		(member) => !member || isVisibleToSuppliers(member.revision.state)
	);
}

const invalid = (message: string, field: string, position?: number | null): FitRefusal => ({
	ok: false,
	status: 400,
	code: 'invalid',
	message: `${field}: ${message}`,
	field,
	...(position === null || position === undefined ? {} : { position })
});

/** The members looked up in the team and checked; a refusal names the field. */
async function resolveMembers(
	db: Db,
	place: FitPlace,
	ids: { hole: string; shaft: string | null; fixedHole: string | null }
): Promise<{ ok: true; members: Members } | FitRefusal> {
	const placed = await placedFeatures(
		db,
		place.team.id,
		[ids.hole, ids.shaft, ids.fixedHole].filter((id): id is string => !!id)
	);
	const hole = placed.get(ids.hole);
	if (!hole || hole.revision.id !== place.revision.id)
		return invalid(
			`the hole must be a feature of revision ${place.revision.letter} of ${place.drawing.number} (a fit belongs to its hole's revision)`,
			'holeFeatureId'
		);
	if (!hole.feature.callout || !hole.feature.internal)
		return invalid(`${describe(hole)} is not a hole with a size`, 'holeFeatureId');
	let shaft: PlacedFeature | null = null;
	if (ids.shaft) {
		shaft = placed.get(ids.shaft) ?? null;
		if (!shaft) return invalid('no such feature on any drawing of this team', 'shaftFeatureId');
		if (shaft.feature.id === hole.feature.id)
			return invalid('a feature does not fit itself', 'shaftFeatureId');
		if (!shaft.feature.callout || shaft.feature.internal)
			return invalid(
				`${describe(shaft)} is not an external feature (shaft, pin) with a size`,
				'shaftFeatureId'
			);
	}
	let fixedHole: PlacedFeature | null = null;
	if (ids.fixedHole) {
		fixedHole = placed.get(ids.fixedHole) ?? null;
		if (!fixedHole)
			return invalid('no such feature on any drawing of this team', 'fixedHoleFeatureId');
	}
	return { ok: true, members: { hole, shaft, fixedHole } };
}

function checked(values: Parameters<typeof evaluation>[0], members: Members) {
	const result = evaluation(values, members);
	if (result.ok) return { ok: true as const, result };
	const where = result.member === 'fit' ? result.field : `${result.member}.${result.field}`;
	return { ok: false as const, refusal: invalid(result.message, where, result.position) };
}

function summaryOf(m: Members, fastener: FitRow['fastener']) {
	const other = m.shaft ? describe(m.shaft) : `${fastener?.callout ?? ''} ${fastener?.label ?? ''}`;
	return `${describe(m.hole)} with ${other.trim()}`;
}

const refusalFor = (db: Db, place: FitPlace, err: unknown): Promise<FitRefusal> =>
	writeRefusal(err, 'fit', (row: FitRow) => fitOf(db, place, row));

/**
 * Left out, the intent is read from the other member and the limits: a fastener floats, a
 * clearance fit runs, a transition or interference fit is what it is.
 */
function intentOf(input: FitCreate, classification: FitClassification | null): FitIntent {
	if (input.fastener) return input.fixedHoleFeatureId ? 'fixed-fastener' : 'floating-fastener';
	return !classification || classification === 'clearance' ? 'running' : classification;
}

export type FitOutcome = { ok: true; fit: FitJson } | FitRefusal;

export async function addFit(
	db: Db,
	actor: Actor,
	place: FitPlace,
	input: FitCreate
): Promise<FitOutcome> {
	const found = await resolveMembers(db, place, {
		hole: input.holeFeatureId,
		shaft: input.shaftFeatureId,
		fixedHole: input.fixedHoleFeatureId
	});
	if (!found.ok) return found;
	const check = checked(input, found.members);
	if (!check.ok) return check.refusal;
	const { members } = found;
	const intent = input.intent ?? intentOf(input, check.result.classification);
	try {
		const row = await createFit(
			db,
			actor,
			place.drawing,
			place.revision,
			{
				holeFeatureId: input.holeFeatureId,
				shaftFeatureId: input.shaftFeatureId,
				shaftRevisionId: members.shaft?.revision.id ?? null,
				fastener: input.fastener,
				fixedHoleFeatureId: input.fixedHoleFeatureId,
				// Left out: what the limits make of it.
				intent,
				requiredMinClearance: input.requiredMinClearance,
				requiredMaxClearance: input.requiredMaxClearance,
				sharedDatumFrame: input.sharedDatumFrame,
				temperature: input.temperature
			},
			summaryOf(members, input.fastener)
		);
		return { ok: true, fit: await fitOf(db, place, row) };
	} catch (err) {
		return refusalFor(db, place, err);
	}
}

/** A fit is changed only through its hole's revision; elsewhere it is listed read-only. */
function notOwner(place: FitPlace, fit: FitRow, members: Members): FitRefusal | null {
	if (fit.revisionId === place.revision.id) return null;
	return {
		ok: false,
		status: 409,
		code: 'not_owner',
		message: `This fit belongs to revision ${members.hole.revision.letter} of ${members.hole.drawing.number} (its hole's drawing): change it there.`
	};
}

export async function editFit(
	db: Db,
	actor: Actor,
	place: FitPlace,
	fit: FitRow,
	patch: FitPatch
): Promise<FitOutcome> {
	const { version, ...changes } = patch;
	const current = (await membersOf(db, place.team.id, [fit]))(fit);
	const refused = notOwner(place, fit, current);
	if (refused) return refused;
	const next = { ...fit, ...changes };
	if (changes.fastener) next.shaftFeatureId = null;
	else if (changes.shaftFeatureId) next.fastener = null;
	if (!next.shaftFeatureId === !next.fastener)
		return invalid(
			'Give the other member: either shaftFeatureId or a bought fastener',
			'shaftFeatureId'
		);
	const found = await resolveMembers(db, place, {
		hole: fit.holeFeatureId,
		shaft: next.shaftFeatureId ?? null,
		fixedHole: next.fixedHoleFeatureId ?? null
	});
	if (!found.ok) return found;
	const check = checked(next, found.members);
	if (!check.ok) return check.refusal;
	try {
		const row = await updateFit(
			db,
			actor,
			place.drawing,
			place.revision,
			fit,
			version,
			{
				...changes,
				shaftFeatureId: next.shaftFeatureId,
				fastener: next.fastener,
				shaftRevisionId: found.members.shaft?.revision.id ?? null
			},
			summaryOf(found.members, next.fastener)
		);
		return { ok: true, fit: await fitOf(db, place, row) };
	} catch (err) {
		return refusalFor(db, place, err);
	}
}

export async function removeFit(
	db: Db,
	actor: Actor,
	place: FitPlace,
	fit: FitRow,
	version: number
): Promise<{ ok: true } | FitRefusal> {
	const members = (await membersOf(db, place.team.id, [fit]))(fit);
	const refused = notOwner(place, fit, members);
	if (refused) return refused;
	try {
		await deleteFit(
			db,
			actor,
			place.drawing,
			place.revision,
			fit,
			version,
			summaryOf(members, fit.fastener)
		);
		return { ok: true };
	} catch (err) {
		return refusalFor(db, place, err);
	}
}
