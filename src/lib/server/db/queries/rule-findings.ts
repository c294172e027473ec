/*
 * The rulebook on stored drawings (PRODUCT.md §3, §5): a revision's features and fits read into
 * the core, judged in full or through its incremental entry (`only`), and its results kept as
 * findings of kind `rule`, one per result key (rule, subject, cause). Runs inside the
 * transaction of the change that calls for it, so the findings never disagree with the data.
 *
 * A result's home is the revision of its subject: the drawing's and a feature's results stay on
 * their own revision, a fit's on its hole's (the fit's owner). A change to a member of a fit
 * whose other side sits on another revision re-checks that side too, unless it is frozen.
 */
import { and, eq, inArray, isNotNull, or, sql } from 'drizzle-orm';
import { findingName, isOpen } from '$lib/findings';
import {
	evaluate,
	scopeOf,
	type RuleResult,
	type RulebookDrawing,
	type RulebookFeature,
	type RulebookFit,
	type RulebookTeam
} from '$lib/tolerance/rulebook';
import type { Db } from '../connect';
import {
	drawings,
	features,
	findingMoves,
	findings,
	fits,
	isFrozen,
	revisions,
	teams,
	users,
	type DrawingRow,
	type FeatureRow,
	type FindingRow,
	type FitRow,
	type RevisionRow
} from '../schema';
import { recordActivity, type Actor } from './activity';
import { appendEvent } from './revision-events';

/** What a change touched: everything, or these features and fits (ids gone are fine). */
export type RecheckScope = 'full' | { featureIds?: readonly string[]; fitIds?: readonly string[] };

/** What a re-check changed, and the notes on what it left alone. */
export interface RecheckOutcome {
	raised: number;
	reopened: number;
	resolved: number;
	lapsed: number;
	notes: string[];
}

const CHUNK = 500;

/** The subject of a result as its key names it: `drawing`, `feature:<id>` or `fit:<id>`. */
export function subjectOf(r: Pick<RuleResult, 'subject' | 'featureId' | 'fitId'>): string {
	return r.subject === 'drawing'
		? 'drawing'
		: r.subject === 'feature'
			? `feature:${r.featureId}`
			: `fit:${r.fitId}`;
}

/** A rule finding's text: what is wrong, the numbers behind it, the fix, the clause, the rule. */
export function ruleFindingText(r: RuleResult): string {
	return [
		r.message,
		`Numbers: ${r.line}`,
		`Fix: ${r.fix}`,
		...(r.clause ? [`Clause: ${r.clause}`] : []),
		`Rule: /rules/${r.rule}`
	].join('\n');
}

/** A stored feature as the rulebook reads it; `drawing` for one judged under another drawing. */
export function rulebookFeature(row: FeatureRow, drawing?: RulebookDrawing): RulebookFeature {
	return {
		id: row.id,
		balloon: row.balloon,
		label: row.label,
		kind: row.kind,
		internal: row.internal,
		callout: row.callout,
		quantity: row.quantity,
		controls: row.controls,
		overrides: row.overrides,
		datumFeature: row.datumFeature ?? undefined,
		boughtOut: row.boughtOut,
		notes: row.notes,
		...(drawing ? { drawing } : {})
	};
}

function rulebookFit(row: FitRow): RulebookFit {
	return {
		id: row.id,
		holeFeatureId: row.holeFeatureId,
		shaftFeatureId: row.shaftFeatureId,
		fastener: row.fastener,
		fixedHoleFeatureId: row.fixedHoleFeatureId,
		intent: row.intent,
		sharedDatumFrame: row.sharedDatumFrame,
		temperature: row.temperature,
		requiredMinClearance: row.requiredMinClearance,
		requiredMaxClearance: row.requiredMaxClearance
	};
}

const membersOf = (fit: FitRow) =>
	[fit.holeFeatureId, fit.shaftFeatureId, fit.fixedHoleFeatureId].filter(
		(id): id is string => !!id
	);

function judgedDrawing(revision: RevisionRow, drawing: DrawingRow, datums: string[]) {
	return { ...revision.settings, notes: drawing.notes, datums } satisfies RulebookDrawing;
}

/** A feature of size goes to the rulebook; a plain face (no callout) only defines its datum. */
const sized = (row: FeatureRow) => row.callout.trim() !== '';

interface Place {
	revision: RevisionRow;
	drawing: DrawingRow;
	team: RulebookTeam;
}

/** The revision (locked), its drawing and its team's rulebook settings, in one query. */
async function placeOf(tx: Db, revisionId: string): Promise<Place> {
	const [row] = await tx
		.select({ revision: revisions, drawing: drawings, settings: teams.settings })
		.from(revisions)
		.innerJoin(drawings, eq(drawings.id, revisions.drawingId))
		.innerJoin(teams, eq(teams.id, drawings.teamId))
		.where(eq(revisions.id, revisionId))
		.for('update', { of: revisions });
	return {
		revision: row.revision,
		drawing: row.drawing,
		team: {
			severityOverrides: row.settings.severityOverrides,
			capabilityGrade: row.settings.capabilityGrade ?? null
		}
	};
}

/** A feature of another revision with the drawing it is judged under. */
interface Foreign {
	row: FeatureRow;
	revision: RevisionRow;
	drawing: DrawingRow;
}

async function foreignFeatures(tx: Db, ids: string[], home: string) {
	const out = new Map<string, Foreign>();
	for (let i = 0; i < ids.length; i += CHUNK) {
		const rows = await tx
			.select({ row: features, revision: revisions, drawing: drawings })
			.from(features)
			.innerJoin(revisions, eq(revisions.id, features.revisionId))
			.innerJoin(drawings, eq(drawings.id, features.drawingId))
			.where(inArray(features.id, ids.slice(i, i + CHUNK)));
		for (const r of rows) if (r.revision.id !== home) out.set(r.row.id, r);
	}
	return out;
}

interface Loaded {
	own: FeatureRow[];
	foreign: Map<string, Foreign>;
	fits: FitRow[];
	datums: string[];
}

/** Every feature of the revision, the fits listed on it and their members elsewhere. */
async function loadAll(tx: Db, revision: RevisionRow): Promise<Loaded> {
	const own = await tx.select().from(features).where(eq(features.revisionId, revision.id));
	const fitRows = await tx
		.select()
		.from(fits)
		.where(or(eq(fits.revisionId, revision.id), eq(fits.shaftRevisionId, revision.id)))
		.orderBy(fits.createdAt, fits.id);
	const ownIds = new Set(own.map((f) => f.id));
	const elsewhere = [...new Set(fitRows.flatMap(membersOf))].filter((id) => !ownIds.has(id));
	const datums = own.filter((f) => f.datumFeature).map((f) => f.datumFeature!);
	return { own, foreign: await foreignFeatures(tx, elsewhere, revision.id), fits: fitRows, datums };
}

const fitsTouching = (ids: string[], fitIds: readonly string[]) =>
	or(
		fitIds.length ? inArray(fits.id, [...fitIds]) : undefined,
		...(ids.length
			? [
					inArray(fits.holeFeatureId, ids),
					inArray(fits.shaftFeatureId, ids),
					inArray(fits.fixedHoleFeatureId, ids)
				]
			: [])
	);

/**
 * What an incremental run needs: the touched features, the fits touched or referencing them,
 * those fits' members, every fit those members belong to (their memberships count in their
 * own results), and the revision's datum letters.
 */
async function loadTouched(
	tx: Db,
	revision: RevisionRow,
	featureIds: readonly string[],
	fitIds: readonly string[]
): Promise<Loaded> {
	const first = await tx
		.select()
		.from(fits)
		.where(fitsTouching([...featureIds], fitIds));
	const members = [...new Set([...featureIds, ...first.flatMap(membersOf)])];
	const fitRows = members.length
		? await tx
				.select()
				.from(fits)
				.where(fitsTouching(members, fitIds))
				.orderBy(fits.createdAt, fits.id)
		: first;
	const own = members.length
		? await tx
				.select()
				.from(features)
				.where(and(eq(features.revisionId, revision.id), inArray(features.id, members)))
		: [];
	const ownIds = new Set(own.map((f) => f.id));
	const foreign = await foreignFeatures(
		tx,
		members.filter((id) => !ownIds.has(id)),
		revision.id
	);
	const letters = await tx
		.selectDistinct({ letter: features.datumFeature })
		.from(features)
		.where(and(eq(features.revisionId, revision.id), isNotNull(features.datumFeature)));
	return { own, foreign, fits: fitRows, datums: letters.map((l) => l.letter!) };
}

/** The other revisions a run reaches, with what to re-check there. */
type Reach = Map<string, { featureIds: Set<string>; fitIds: Set<string> }>;

function reach(map: Reach, revisionId: string, featureIds: string[], fitId: string | null) {
	let entry = map.get(revisionId);
	if (!entry) map.set(revisionId, (entry = { featureIds: new Set(), fitIds: new Set() }));
	for (const id of featureIds) entry.featureIds.add(id);
	if (fitId) entry.fitIds.add(fitId);
}

/**
 * Re-checks what `scope` touched on the revision and keeps its rule findings true, in `tx`;
 * `cascade` also re-checks the other side of fits that cross to another revision.
 */
export async function recheckRevision(
	tx: Db,
	actor: Actor | null,
	revisionId: string,
	scope: RecheckScope,
	cascade = true
): Promise<RecheckOutcome> {
	const place = await placeOf(tx, revisionId);
	const { revision, drawing, team } = place;
	const outcome: RecheckOutcome = { raised: 0, reopened: 0, resolved: 0, lapsed: 0, notes: [] };
	if (isFrozen(revision.state)) return outcome;
	// ENV-04 reads every feature when no standard is stated: judge the whole revision then.
	const full = scope === 'full' || revision.settings.standard === 'unstated';
	const featureIds = scope === 'full' ? [] : [...(scope.featureIds ?? [])];
	const fitIds = scope === 'full' ? [] : [...(scope.fitIds ?? [])];
	const loaded = full
		? await loadAll(tx, revision)
		: await loadTouched(tx, revision, featureIds, fitIds);

	const featureList: RulebookFeature[] = loaded.own.filter(sized).map((f) => rulebookFeature(f));
	const foreignDrawings = new Map<string, RulebookDrawing>();
	for (const f of loaded.foreign.values()) {
		if (!sized(f.row)) continue;
		let d = foreignDrawings.get(f.revision.id);
		if (!d) foreignDrawings.set(f.revision.id, (d = judgedDrawing(f.revision, f.drawing, [])));
		featureList.push(rulebookFeature(f.row, d));
	}
	const input = {
		drawing: judgedDrawing(revision, drawing, loaded.datums),
		features: featureList,
		fits: loaded.fits.map(rulebookFit),
		team,
		...(full ? {} : { only: { featureIds, fitIds } })
	};
	const results = evaluate(input);
	const ownIds = new Set(loaded.own.map((f) => f.id));
	const fitRows = new Map(loaded.fits.map((f) => [f.id, f]));
	const home = (r: RuleResult) =>
		r.subject === 'drawing' ||
		(r.subject === 'feature'
			? ownIds.has(r.featureId!)
			: fitRows.get(r.fitId!)?.revisionId === revision.id);

	let subjects: Set<string> | null = null;
	const others: Reach = new Map();
	if (full) {
		// The fits of other revisions that use a feature of this one read its settings too.
		for (const fit of loaded.fits)
			if (fit.revisionId !== revision.id) reach(others, fit.revisionId, [], fit.id);
	} else {
		const judged = scopeOf(input);
		subjects = new Set();
		const known = new Set([...ownIds, ...loaded.foreign.keys()]);
		for (const id of [...judged.featureIds, ...featureIds]) {
			if (ownIds.has(id) || !known.has(id)) subjects.add(`feature:${id}`);
			const other = loaded.foreign.get(id);
			if (other) reach(others, other.revision.id, [id], null);
		}
		for (const id of [...judged.fitIds, ...fitIds]) {
			const fit = fitRows.get(id);
			if (!fit || fit.revisionId === revision.id) subjects.add(`fit:${id}`);
			else reach(others, fit.revisionId, [], id);
		}
	}
	await keepFindings(tx, actor, place, results.filter(home), subjects, outcome);
	// Open boards read the findings again when the rulebook raised, reopened or resolved any.
	if (outcome.raised + outcome.reopened + outcome.resolved + outcome.lapsed > 0) {
		await appendEvent(tx, {
			revisionId: revision.id,
			type: 'finding',
			action: 'recheck',
			id: revision.id,
			version: null
		});
	}

	if (cascade) {
		for (const [otherId, touched] of others) {
			const [other] = await tx
				.select({ state: revisions.state, letter: revisions.letter, number: drawings.number })
				.from(revisions)
				.innerJoin(drawings, eq(drawings.id, revisions.drawingId))
				.where(eq(revisions.id, otherId));
			if (isFrozen(other.state)) {
				const note = `Revision ${other.letter} of ${other.number} is ${other.state}: its side of the fits was left as it was, not re-checked.`;
				outcome.notes.push(note);
				await recordRulebook(tx, actor, place, note);
				continue;
			}
			const more = await recheckRevision(
				tx,
				actor,
				otherId,
				{ featureIds: [...touched.featureIds], fitIds: [...touched.fitIds] },
				false
			);
			outcome.raised += more.raised;
			outcome.reopened += more.reopened;
			outcome.resolved += more.resolved;
			outcome.lapsed += more.lapsed;
		}
	}
	return outcome;
}

/** The revision's rule findings about `subjects` (all of them when null). */
async function storedRuleFindings(tx: Db, revisionId: string, subjects: Set<string> | null) {
	const base = and(eq(findings.revisionId, revisionId), eq(findings.kind, 'rule'));
	if (!subjects) return tx.select().from(findings).where(base);
	const list = [...subjects];
	const out: FindingRow[] = [];
	for (let i = 0; i < list.length; i += CHUNK) {
		out.push(
			...(await tx
				.select()
				.from(findings)
				.where(and(base, inArray(findings.ruleSubject, list.slice(i, i + CHUNK)))))
		);
	}
	return out;
}

type Move = typeof findingMoves.$inferInsert;

async function describeWaiver(tx: Db, w: NonNullable<FindingRow['waiver']>) {
	const [who] = w.by
		? await tx
				.select({ name: sql<string>`coalesce(${users.name}, ${users.email})` })
				.from(users)
				.where(eq(users.id, w.by))
		: [];
	return `waived by ${who?.name ?? 'a former member'} on ${w.at.slice(0, 10)} because: ${w.reason}`;
}

/**
 * Makes the stored rule findings about the judged subjects agree with the results: a new result
 * raises a finding, one whose cause went away is resolved, one that came back is raised again,
 * and a waiver lapses when the numbers behind its finding change. History and trail say so.
 */
async function keepFindings(
	tx: Db,
	actor: Actor | null,
	{ revision, drawing }: Place,
	results: RuleResult[],
	subjects: Set<string> | null,
	outcome: RecheckOutcome
) {
	const stored = await storedRuleFindings(tx, revision.id, subjects);
	const byKey = new Map(stored.map((f) => [f.ruleKey, f]));
	const seen = new Set<string>();
	const fresh: RuleResult[] = [];
	const moves: Move[] = [];
	const said: string[] = [];
	for (const r of results) {
		if (seen.has(r.key)) continue;
		seen.add(r.key);
		const found = byKey.get(r.key);
		if (!found) {
			fresh.push(r);
			continue;
		}
		const text = ruleFindingText(r);
		const set: Partial<typeof findings.$inferInsert> = {};
		let state = found.state;
		if (found.text !== text) set.text = text;
		if (found.severity !== r.severity) set.severity = r.severity;
		if (found.ruleNumbers !== r.line) set.ruleNumbers = r.line;
		if (state === 'resolved' || state === 'verified') {
			state = set.state = 'raised';
			moves.push({
				findingId: found.id,
				from: found.state,
				to: state,
				message: `The rulebook finds this again: ${r.line}`,
				byId: null
			});
			outcome.reopened++;
			said.push(`raised ${findingName(found.number)} again`);
		}
		if (found.waiver && found.ruleNumbers !== r.line) {
			set.waiver = null;
			moves.push({
				findingId: found.id,
				from: state,
				to: state,
				message: `Waiver lapsed, the numbers changed (were: ${found.ruleNumbers}; now: ${r.line}). It was ${await describeWaiver(tx, found.waiver)}`,
				byId: null
			});
			outcome.lapsed++;
			said.push(`the waiver of ${findingName(found.number)} lapsed`);
		}
		if (Object.keys(set).length) await rewrite(tx, found.id, set);
	}
	for (const found of stored) {
		if (seen.has(found.ruleKey!) || !isOpen(found.state)) continue;
		moves.push({
			findingId: found.id,
			from: found.state,
			to: 'resolved',
			message: 'The rulebook no longer finds this: its cause went away.',
			byId: null
		});
		await rewrite(tx, found.id, { state: 'resolved' });
		outcome.resolved++;
		said.push(`resolved ${findingName(found.number)}`);
	}
	if (fresh.length) said.unshift(...(await raise(tx, revision, drawing, fresh)));
	outcome.raised += fresh.length;
	for (let i = 0; i < moves.length; i += CHUNK)
		await tx.insert(findingMoves).values(moves.slice(i, i + CHUNK));
	if (!said.length) return;
	const shown = said.length > 12 ? [...said.slice(0, 12), `and ${said.length - 12} more`] : said;
	await recordRulebook(tx, actor, { revision, drawing }, shown.join(', '), {
		raised: fresh.length,
		reopened: outcome.reopened,
		resolved: outcome.resolved
	});
}

/** What the rulebook did on a revision, on the trail, in the name of whose change called it. */
async function recordRulebook(
	tx: Db,
	actor: Actor | null,
	{ revision, drawing }: Pick<Place, 'revision' | 'drawing'>,
	what: string,
	after?: Record<string, number>
) {
	await recordActivity(tx, {
		teamId: drawing.teamId,
		actor,
		entity: 'revision',
		entityId: revision.id,
		drawingId: drawing.id,
		action: 'rulebook',
		summary: `the rulebook on revision ${revision.letter} of ${drawing.number}: ${what}`,
		...(after ? { after } : {})
	});
}

async function rewrite(tx: Db, id: string, set: Partial<typeof findings.$inferInsert>) {
	await tx
		.update(findings)
		.set({ ...set, version: sql`${findings.version} + 1`, updatedAt: new Date() })
		.where(eq(findings.id, id));
}

/** New rule findings with the drawing's next numbers, in the order found. */
async function raise(tx: Db, revision: RevisionRow, drawing: DrawingRow, fresh: RuleResult[]) {
	const [counter] = await tx
		.update(drawings)
		.set({ nextFinding: sql`${drawings.nextFinding} + ${fresh.length}` })
		.where(eq(drawings.id, drawing.id))
		.returning({ next: drawings.nextFinding });
	const first = counter.next - fresh.length;
	const rows = fresh.map((r, i) => ({
		teamId: drawing.teamId,
		drawingId: drawing.id,
		revisionId: revision.id,
		number: first + i,
		kind: 'rule' as const,
		rule: r.rule,
		ruleKey: r.key,
		ruleSubject: subjectOf(r),
		ruleNumbers: r.line,
		severity: r.severity,
		text: ruleFindingText(r),
		featureId: r.featureId,
		fitId: r.subject === 'fit' ? r.fitId : null,
		raisedBy: null
	}));
	for (let i = 0; i < rows.length; i += CHUNK)
		await tx.insert(findings).values(rows.slice(i, i + CHUNK));
	return rows.map((r) => `raised ${findingName(r.number)} (${r.rule})`);
}
