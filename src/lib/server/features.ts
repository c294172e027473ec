/*
 * Features of size on a revision: the service behind the JSON routes and any form action.
 * Callers check who is asking (`requireRevision`); these functions check the rest (the callout
 * reads, the revision is not frozen, the version is current) and answer an Outcome either way.
 */
import { findingJson, sizeJson } from '$lib/calc-api';
import { internalKinds, type FeatureJson } from '$lib/features';
import type { FeatureInput, FeaturePatch } from '$lib/schemas/features';
import { evaluateFeature, type FeatureResult } from '$lib/tolerance/feature';
import { evaluate, type RuleResult, type RulebookTeam } from '$lib/tolerance/rulebook';
import { writeRefusal } from './api';
import type { Db } from './db/connect';
import type { Actor } from './db/queries/activity';
import {
	createFeature,
	createFeatures,
	deleteFeature,
	FeatureInUse,
	listFeatures,
	storedFeature,
	updateFeature
} from './db/queries/features';
import { rulebookFeature } from './db/queries/rule-findings';
import type { DrawingRow, FeatureRow, RevisionRow, TeamRow } from './db/schema';

/** Where a feature sits: the team (for its rulebook settings), the drawing and the revision. */
export interface FeaturePlace {
	team: Pick<TeamRow, 'settings'>;
	drawing: DrawingRow;
	revision: RevisionRow;
}

export type Refusal = {
	ok: false;
	status: 400 | 404 | 409;
	code: 'invalid' | 'not_found' | 'stale' | 'frozen' | 'in_use';
	fits?: string[];
	message: string;
	field?: string;
	position?: number;
	current?: FeatureJson | null;
};
export type Outcome = { ok: true; feature: FeatureJson } | Refusal;

/** The callout evaluated under the revision's own settings; null for a plain datum face. */
function evaluation(
	place: FeaturePlace,
	f: Pick<FeatureRow, 'callout' | 'controls' | 'overrides'> & { internal?: boolean; notes?: string }
): FeatureResult | null {
	if (!f.callout) return null;
	const { settings } = place.revision;
	const notes = [place.drawing.notes, f.notes].filter(Boolean).join('\n');
	return evaluateFeature({
		callout: f.callout,
		internal: f.internal,
		units: settings.units,
		standard: settings.standard,
		generalTolerance: settings.generalTolerance,
		controls: f.controls,
		overrides: f.overrides,
		notes: notes || undefined
	});
}

function featureJson(place: FeaturePlace, row: FeatureRow, findings: RuleResult[]): FeatureJson {
	const result = evaluation(place, row);
	let computed: Partial<Omit<ReturnType<typeof sizeJson>, 'callout' | 'internal'>> & {
		canonical?: string;
	} = {};
	let problem: { message: string; field: string; position: number | null } | null = null;
	if (result?.ok) {
		const { callout: canonical, internal: _internal, ...values } = sizeJson(result, findings);
		computed = { canonical, ...values };
	} else if (result) {
		problem = { message: result.message, field: result.field, position: result.position };
	}
	return {
		...storedFeature(row),
		createdAt: row.createdAt.toISOString(),
		updatedAt: row.updatedAt.toISOString(),
		settings: place.revision.settings,
		problem,
		findings: findings.map(findingJson),
		...computed
	};
}

/** The rulebook's per-feature results over the revision's features (datums come from them). */
function rulebookFindings(place: FeaturePlace, rows: FeatureRow[]) {
	const faces = rows.filter((r) => !r.callout && r.datumFeature);
	const sized = rows.filter((r) => r.callout);
	const team: RulebookTeam = {
		severityOverrides: place.team.settings.severityOverrides,
		capabilityGrade: place.team.settings.capabilityGrade ?? null
	};
	const results = evaluate({
		drawing: {
			...place.revision.settings,
			notes: place.drawing.notes,
			datums: faces.map((f) => f.datumFeature!)
		},
		features: sized.map((r) => rulebookFeature(r)),
		fits: [],
		team
	});
	const byFeature = new Map<string, RuleResult[]>();
	for (const r of results) {
		if (r.subject !== 'feature' || !r.featureId) continue;
		const list = byFeature.get(r.featureId) ?? [];
		list.push(r);
		byFeature.set(r.featureId, list);
	}
	return (id: string) => byFeature.get(id) ?? [];
}

/** Every feature of the revision, balloon order, with computed values and findings. */
export async function featuresOf(db: Db, place: FeaturePlace) {
	const rows = await listFeatures(db, place.revision.id);
	const findingsOf = rulebookFindings(place, rows);
	return rows.map((row) => featureJson(place, row, findingsOf(row.id)));
}

/** One feature as the API answers it (its findings judged among its revision's features). */
export async function featureOf(db: Db, place: FeaturePlace, row: FeatureRow) {
	const rows = await listFeatures(db, place.revision.id);
	return featureJson(place, row, rulebookFindings(place, rows)(row.id));
}

/**
 * Internal or external: as given, else the ISO 286 code's letter case, else the kind (holes,
 * bores and slots are internal).
 */
function resolveInternal(
	place: FeaturePlace,
	f: Parameters<typeof evaluation>[1] & Pick<FeatureRow, 'kind'>
) {
	if (f.internal !== undefined) return f.internal;
	const guessed = evaluation(place, f);
	if (guessed?.ok) return guessed.internal;
	return internalKinds.includes(f.kind);
}

/** A callout that does not read is refused with where it fails, and nothing is stored. */
function checkValues(place: FeaturePlace, values: Parameters<typeof evaluation>[1]) {
	const result = evaluation(place, values);
	if (!result || result.ok) return { ok: true as const, result };
	return {
		ok: false as const,
		refusal: {
			ok: false,
			status: 400,
			code: 'invalid',
			message: `${result.field}: ${result.message}`,
			field: result.field,
			...(result.position === null ? {} : { position: result.position })
		} satisfies Refusal
	};
}

async function refusalFor(db: Db, place: FeaturePlace, err: unknown): Promise<Refusal> {
	if (err instanceof FeatureInUse) {
		return { ok: false, status: 409, code: 'in_use', message: `${err.message}.`, fits: err.fitIds };
	}
	return writeRefusal(err, 'feature', (row: FeatureRow) => featureOf(db, place, row));
}

export async function addFeature(
	db: Db,
	actor: Actor,
	place: FeaturePlace,
	input: FeatureInput
): Promise<Outcome> {
	const bad = checkLocation(place, input.location);
	if (bad) return bad;
	const internal = resolveInternal(place, input);
	const checked = checkValues(place, { ...input, internal });
	if (!checked.ok) return checked.refusal;
	const spec = checked.result?.ok ? checked.result.spec : null;
	try {
		const row = await createFeature(db, actor, place.drawing, place.revision, {
			...input,
			internal,
			quantity: input.quantity ?? spec?.quantity ?? 1
		});
		return { ok: true, feature: await featureOf(db, place, row) };
	} catch (err) {
		return refusalFor(db, place, err);
	}
}

export async function editFeature(
	db: Db,
	actor: Actor,
	place: FeaturePlace,
	feature: FeatureRow,
	patch: FeaturePatch
): Promise<Outcome> {
	const { version, ...changes } = patch;
	if (changes.location !== undefined) {
		const bad = checkLocation(place, changes.location);
		if (bad) return bad;
	}
	const next = { ...feature, ...changes };
	if (!next.callout && !next.datumFeature) {
		return {
			ok: false,
			status: 400,
			code: 'invalid',
			message: 'callout: Write the callout, or mark a plain face as a datum feature',
			field: 'callout'
		};
	}
	// A new callout guesses internal again unless it is given; quantity follows a new `4X`.
	if (changes.callout !== undefined && changes.internal === undefined) {
		next.internal = resolveInternal(place, { ...next, internal: undefined });
		changes.internal = next.internal;
	}
	const computedChanged = ['callout', 'internal', 'controls', 'overrides', 'notes'].some(
		(k) => k in changes
	);
	if (computedChanged) {
		const checked = checkValues(place, next);
		if (!checked.ok) return checked.refusal;
		if (changes.callout !== undefined && changes.quantity === undefined && checked.result?.ok) {
			const written = checked.result.spec.quantity;
			if (written) changes.quantity = written;
		}
	}
	try {
		const row = await updateFeature(
			db,
			actor,
			place.drawing,
			place.revision,
			feature,
			version,
			changes
		);
		return { ok: true, feature: await featureOf(db, place, row) };
	} catch (err) {
		return refusalFor(db, place, err);
	}
}

export async function removeFeature(
	db: Db,
	actor: Actor,
	place: FeaturePlace,
	feature: FeatureRow,
	version: number
): Promise<{ ok: true } | Refusal> {
	try {
		await deleteFeature(db, actor, place.drawing, place.revision, feature, version);
		return { ok: true };
	} catch (err) {
		return refusalFor(db, place, err);
	}
}

/** A location on a sheet the revision has (the schema already holds it within 0..1). */
export function checkLocation(
	place: Pick<FeaturePlace, 'revision'>,
	location: FeatureRow['location']
): Refusal | null {
	if (!location || location.sheet <= place.revision.pages) return null;
	return {
		ok: false,
		status: 400,
		code: 'invalid',
		message: `location: revision ${place.revision.letter} has ${place.revision.pages} sheet${place.revision.pages === 1 ? '' : 's'}`,
		field: 'location'
	};
}

/** A bad row of an imported file: its line (the header is line 1) and why. */
export interface RowProblem {
	line: number;
	reason: string;
}

export type ImportOutcome =
	| { ok: true; features: FeatureJson[] }
	| Refusal
	| {
			ok: false;
			status: 422;
			code: 'invalid_rows';
			message: string;
			rows: RowProblem[];
	  };

/**
 * Adds the rows of an imported file, all or none: each row is checked as `addFeature` checks
 * one, its callout read under the revision's settings; a file's features are not yet placed.
 * The rulebook re-checks them once, together.
 */
export async function importFeatures(
	db: Db,
	actor: Actor,
	place: FeaturePlace,
	rows: { line: number; input: FeatureInput }[],
	problems: RowProblem[]
): Promise<ImportOutcome> {
	const list = [];
	const bad = [...problems];
	for (const { line, input } of rows) {
		const internal = resolveInternal(place, input);
		const checked = checkValues(place, { ...input, internal });
		if (!checked.ok) {
			bad.push({ line, reason: checked.refusal.message });
			continue;
		}
		const spec = checked.result?.ok ? checked.result.spec : null;
		list.push({
			...input,
			location: input.location ?? null,
			internal,
			quantity: input.quantity ?? spec?.quantity ?? 1
		});
	}
	if (bad.length > 0) {
		bad.sort((a, b) => a.line - b.line);
		return {
			ok: false,
			status: 422,
			code: 'invalid_rows',
			message: `Nothing was imported: ${bad.length} row${bad.length === 1 ? '' : 's'} could not be read (first: line ${bad[0].line}, ${bad[0].reason})`,
			rows: bad
		};
	}
	try {
		const created = await createFeatures(db, actor, place.drawing, place.revision, list);
		const all = await listFeatures(db, place.revision.id);
		const findingsOf = rulebookFindings(place, all);
		return {
			ok: true,
			features: created.map((row) => featureJson(place, row, findingsOf(row.id)))
		};
	} catch (err) {
		return refusalFor(db, place, err);
	}
}
