/*
 * The rulebook: every rule of PRODUCT.md §5 over one drawing's features and fits. Pure and
 * deterministic: results come in input order of their subject (drawing, then features, then
 * fits) and, within a subject, in rule order. A run limited by `only` gives, for each subject
 * it judges, exactly the results a full run gives for it.
 */
import { featureContext, type FeatureContext } from './context';
import { toResult, type Finding, type Subject } from './emit';
import { featureRules, type Membership } from './feature-rules';
import { drawingNotationRules } from './rules-doc';
import { standardRule } from './rules-env';
import { evaluateFitFor, fitRules } from './rules-fit';
import {
	RULE_CODES,
	type RuleResult,
	type RulebookDrawing,
	type RulebookFeature,
	type RulebookFit,
	type RulebookInput
} from './types';

const RULE_ORDER = new Map<string, number>(RULE_CODES.map((c, i) => [c, i]));

/** The features a fit names: hole, shaft and a fixed fastener's holding hole. */
function memberIds(fit: RulebookFit): (string | null | undefined)[] {
	return [fit.holeFeatureId, fit.shaftFeatureId, fit.fixedHoleFeatureId];
}

function references(fit: RulebookFit, featureId: string): boolean {
	return (
		fit.holeFeatureId === featureId ||
		fit.shaftFeatureId === featureId ||
		fit.fixedHoleFeatureId === featureId
	);
}

function roleOf(fit: RulebookFit, featureId: string): Membership['role'] {
	return fit.holeFeatureId === featureId
		? 'hole'
		: fit.shaftFeatureId === featureId
			? 'shaft'
			: 'fixed-hole';
}

export interface Scope {
	drawing: boolean;
	featureIds: string[];
	fitIds: string[];
}

/**
 * Where each feature and fit sits, which fits reference a feature, and which features define
 * each datum letter. Build it once per revision and pass it to every incremental run so an edit
 * costs what it touches; a stale index (features or fits added, removed or moved) is detected
 * and rebuilt, so it can never change a result.
 */
export interface RulebookIndex {
	featureAt: Map<string, number>;
	fitAt: Map<string, number>;
	fitsOf: Map<string, string[]>;
	datumDefiners: Map<string, string[]>;
}

export function indexRulebook(
	features: readonly RulebookFeature[],
	fits: readonly RulebookFit[]
): RulebookIndex {
	return { ...indexFeatures(features), ...indexFits(fits) };
}

function indexFeatures(features: readonly RulebookFeature[]) {
	const featureAt = new Map<string, number>();
	const datumDefiners = new Map<string, string[]>();
	for (let i = 0; i < features.length; i++) {
		const f = features[i];
		featureAt.set(f.id, i);
		const letter = f.datumFeature?.trim().toUpperCase();
		if (letter) {
			const list = datumDefiners.get(letter);
			if (list) list.push(f.id);
			else datumDefiners.set(letter, [f.id]);
		}
	}
	return { featureAt, datumDefiners };
}

function indexFits(fits: readonly RulebookFit[]) {
	const fitAt = new Map<string, number>();
	const fitsOf = new Map<string, string[]>();
	for (let i = 0; i < fits.length; i++) {
		const fit = fits[i];
		fitAt.set(fit.id, i);
		for (const featureId of memberIds(fit)) {
			if (!featureId) continue;
			const list = fitsOf.get(featureId);
			if (!list) fitsOf.set(featureId, [fit.id]);
			else if (list[list.length - 1] !== fit.id) list.push(fit.id);
		}
	}
	return { fitAt, fitsOf };
}

/**
 * Reads through an index, rebuilding it once if it turns out stale. Without one, it builds
 * only what the run asks for (a full run never needs the fits' part).
 */
class Lookup {
	private features: readonly RulebookFeature[];
	private fits: readonly RulebookFit[];
	private byFeature: Pick<RulebookIndex, 'featureAt' | 'datumDefiners'> | null;
	private byFit: Pick<RulebookIndex, 'fitAt' | 'fitsOf'> | null;
	private rebuilt: boolean;
	constructor(
		features: readonly RulebookFeature[],
		fits: readonly RulebookFit[],
		index: RulebookIndex | undefined
	) {
		this.features = features;
		this.fits = fits;
		this.rebuilt = !index;
		this.byFeature = index ?? null;
		this.byFit = index ?? null;
	}
	private featureIndex() {
		return (this.byFeature ??= indexFeatures(this.features));
	}
	private fitIndex() {
		return (this.byFit ??= indexFits(this.fits));
	}
	private rebuild(): boolean {
		if (this.rebuilt) return false;
		this.byFeature = indexFeatures(this.features);
		this.byFit = indexFits(this.fits);
		this.rebuilt = true;
		return true;
	}
	featurePosition(id: string): number | null {
		const at = this.featureIndex().featureAt.get(id);
		if (at !== undefined && this.features[at]?.id === id) return at;
		return this.rebuild() ? this.featurePosition(id) : null;
	}
	fitPosition(id: string): number | null {
		const at = this.fitIndex().fitAt.get(id);
		if (at !== undefined && this.fits[at]?.id === id) return at;
		return this.rebuild() ? this.fitPosition(id) : null;
	}
	/** Positions of the fits that reference a feature, in input order. */
	fitsReferencing(featureId: string): number[] {
		const out: number[] = [];
		for (const fitId of this.fitIndex().fitsOf.get(featureId) ?? []) {
			const at = this.fitPosition(fitId);
			if (at === null) continue;
			const fit = this.fits[at];
			if (references(fit, featureId)) out.push(at);
			else if (this.rebuild()) return this.fitsReferencing(featureId);
		}
		return out.sort((a, b) => a - b);
	}
	datumDefined(letter: string): boolean {
		for (const id of this.featureIndex().datumDefiners.get(letter) ?? []) {
			const at = this.featurePosition(id);
			if (at !== null && this.features[at].datumFeature?.trim().toUpperCase() === letter)
				return true;
		}
		return false;
	}
}

interface ResolvedScope {
	drawing: boolean;
	/** Positions, ascending. */
	features: number[];
	fits: number[];
	/** Per feature position: the positions of the fits it is a member of, ascending. */
	memberships: { get(at: number): number[] | undefined };
	/**
	 * A full run's member positions, per fit: hole at 3i, shaft at 3i + 1, holding hole at
	 * 3i + 2, -1 for none or one
	 * not found, so the fit pass need not look them up again. Null when limited by `only`.
	 */
	members: Int32Array | null;
}

function resolveScope(input: RulebookInput, lookup: Lookup): ResolvedScope {
	const { features, fits, only } = input;
	if (!only) {
		// Arrays by position rather than maps: a full run touches every feature.
		const byFeature: (number[] | undefined)[] = new Array(features.length);
		const members = new Int32Array(3 * fits.length);
		for (let i = 0; i < fits.length; i++) {
			const { holeFeatureId, shaftFeatureId, fixedHoleFeatureId } = fits[i];
			// As the fit pass reads them: the hole's id as given, the shaft's only when there is one.
			const hole = lookup.featurePosition(holeFeatureId);
			const shaft = shaftFeatureId ? lookup.featurePosition(shaftFeatureId) : null;
			const fixed = fixedHoleFeatureId ? lookup.featurePosition(fixedHoleFeatureId) : null;
			members[3 * i] = hole ?? -1;
			members[3 * i + 1] = shaft ?? -1;
			members[3 * i + 2] = fixed ?? -1;
			if (holeFeatureId && hole !== null) addMembership(byFeature, hole, i);
			if (shaft !== null) addMembership(byFeature, shaft, i);
			if (fixed !== null) addMembership(byFeature, fixed, i);
		}
		return {
			drawing: true,
			features: positions(features.length),
			fits: positions(fits.length),
			memberships: { get: (at) => byFeature[at] },
			members
		};
	}
	const memberships = new Map<number, number[]>();
	const touched = new Set<number>();
	for (const id of only.featureIds ?? []) {
		const at = lookup.featurePosition(id);
		if (at !== null) touched.add(at);
	}
	const touchedFits = new Set<number>();
	for (const id of only.fitIds ?? []) {
		const at = lookup.fitPosition(id);
		if (at !== null) touchedFits.add(at);
	}
	const fitSet = new Set(touchedFits);
	for (const at of touched) for (const f of lookup.fitsReferencing(features[at].id)) fitSet.add(f);
	const featureSet = new Set(touched);
	for (const f of fitSet) {
		for (const id of memberIds(fits[f])) {
			const at = id ? lookup.featurePosition(id) : null;
			if (at !== null) featureSet.add(at);
		}
	}
	for (const at of featureSet) {
		const id = features[at].id;
		const list = new Set(lookup.fitsReferencing(id));
		// A touched fit may have just started referencing the feature.
		for (const f of touchedFits) if (references(fits[f], id)) list.add(f);
		if (list.size)
			memberships.set(
				at,
				[...list].sort((a, b) => a - b)
			);
	}
	return {
		drawing: only.drawing === true,
		features: [...featureSet].sort((a, b) => a - b),
		fits: [...fitSet].sort((a, b) => a - b),
		memberships,
		members: null
	};
}

function addMembership(byFeature: (number[] | undefined)[], at: number, fit: number): void {
	const list = byFeature[at];
	if (!list) byFeature[at] = [fit];
	else if (list[list.length - 1] !== fit) list.push(fit);
}

/** 0, 1, …, n − 1. */
function positions(n: number): number[] {
	const out: number[] = new Array(n);
	for (let i = 0; i < n; i++) out[i] = i;
	return out;
}

/** Which subjects a run judges: everything, or what `only` names and what depends on it. */
export function scopeOf(input: RulebookInput): Scope {
	const scope = resolveScope(input, new Lookup(input.features, input.fits, input.index));
	return {
		drawing: scope.drawing,
		featureIds: scope.features.map((i) => input.features[i].id),
		fitIds: scope.fits.map((i) => input.fits[i].id)
	};
}

function sortFindings(findings: Finding[]): Finding[] {
	return findings.length < 2 ? findings : findings.sort(inRuleOrder);
}

function inRuleOrder(a: Finding, b: Finding): number {
	return (
		(RULE_ORDER.get(a.rule) as number) - (RULE_ORDER.get(b.rule) as number) ||
		(a.cause < b.cause ? -1 : a.cause > b.cause ? 1 : 0)
	);
}

function drawingRules(
	drawing: RulebookDrawing,
	contexts: () => Iterable<FeatureContext>
): Finding[] {
	const out: Finding[] = [];
	standardRule(drawing, contexts, out);
	drawingNotationRules(drawing, out);
	return sortFindings(out);
}

/** Where a fit's members sit, or null when one it names is not there. */
function memberPositions(
	scope: ResolvedScope,
	lookup: Lookup,
	fit: RulebookFit,
	f: number
): { hole: number; shaft: number | null; fixed: number | null } | null {
	let hole: number | null;
	let shaft: number | null;
	let fixed: number | null;
	if (scope.members) {
		const [h, s, x] = [scope.members[3 * f], scope.members[3 * f + 1], scope.members[3 * f + 2]];
		hole = h < 0 ? null : h;
		shaft = s < 0 ? null : s;
		fixed = x < 0 ? null : x;
	} else {
		hole = lookup.featurePosition(fit.holeFeatureId);
		shaft = fit.shaftFeatureId ? lookup.featurePosition(fit.shaftFeatureId) : null;
		fixed = fit.fixedHoleFeatureId ? lookup.featurePosition(fit.fixedHoleFeatureId) : null;
	}
	if (hole === null || (fit.shaftFeatureId && shaft === null)) return null;
	if (fit.fixedHoleFeatureId && fixed === null) return null;
	return { hole, shaft, fixed };
}

/** Runs the rulebook. See `scopeOf` for what a run limited by `only` judges. */
export function evaluate(input: RulebookInput): RuleResult[] {
	const { drawing, features, fits, team } = input;
	const lookup = new Lookup(features, fits, input.index);
	const scope = resolveScope(input, lookup);
	const drawingLetters = new Set((drawing.datums ?? []).map((d) => d.trim().toUpperCase()));
	let letterList: string[] | null = null;
	const datumLetters = {
		has: (letter: string) => drawingLetters.has(letter) || lookup.datumDefined(letter),
		list: () => {
			if (!letterList) {
				const letters = new Set(drawingLetters);
				for (const f of features)
					if (f.datumFeature) letters.add(f.datumFeature.trim().toUpperCase());
				letterList = [...letters].sort();
			}
			return letterList;
		}
	};

	// Fits re-read their members from the callouts, so only whether each member could be read
	// is kept between the two passes: holding every evaluation costs more in memory than it saves.
	// A full run keeps them in an array by position, as it judges every feature.
	const readable = new Map<number, boolean>();
	const readableInFull: boolean[] | null = scope.members ? new Array(features.length) : null;
	const readableAt = (at: number): boolean => {
		let ok = readableInFull ? readableInFull[at] : readable.get(at);
		if (ok === undefined) {
			ok = featureContext(features[at], at, drawing).ok;
			if (readableInFull) readableInFull[at] = ok;
			else readable.set(at, ok);
		}
		return ok;
	};

	const results: RuleResult[] = [];
	if (scope.drawing) {
		const all = function* () {
			for (let i = 0; i < features.length; i++) yield featureContext(features[i], i, drawing);
		};
		const subject: Subject = { subject: 'drawing', featureId: null, fitId: null };
		for (const finding of drawingRules(drawing, all))
			results.push(toResult(finding, subject, team, drawing.standard));
	}

	for (const at of scope.features) {
		const ctx = featureContext(features[at], at, drawing);
		const memberOf: Membership[] = [];
		for (const f of scope.memberships.get(at) ?? []) {
			const fit = fits[f];
			memberOf.push({ fit, role: roleOf(fit, ctx.feature.id) });
		}
		const findings: Finding[] = [];
		featureRules(ctx, { drawing, team, datumLetters, memberships: memberOf }, findings);
		const subject: Subject = {
			subject: 'feature',
			featureId: ctx.feature.id,
			fitId: memberOf.length ? memberOf[0].fit.id : null
		};
		for (const finding of sortFindings(findings))
			results.push(toResult(finding, subject, team, ctx.standard));
		if (memberOf.length) {
			if (readableInFull) readableInFull[at] = ctx.ok;
			else readable.set(at, ctx.ok);
		}
	}

	for (const f of scope.fits) {
		const fit = fits[f];
		if (!fit.shaftFeatureId && !fit.fastener) continue;
		const at = memberPositions(scope, lookup, fit, f);
		if (at === null) continue;
		if (!readableAt(at.hole) || (at.shaft !== null && !readableAt(at.shaft))) continue;
		if (at.fixed !== null && !readableAt(at.fixed)) continue;
		const hole = features[at.hole];
		const shaft = at.shaft === null ? null : features[at.shaft];
		const fixed = at.fixed === null ? null : features[at.fixed];
		const r = evaluateFitFor(fit, hole, shaft, fixed, drawing);
		if (!r.ok) continue;
		const findings: Finding[] = [];
		fitRules(fit, r, hole, shaft, findings);
		const subject: Subject = { subject: 'fit', featureId: fit.holeFeatureId, fitId: fit.id };
		const standard = (hole.drawing ?? drawing).standard;
		for (const finding of sortFindings(findings))
			results.push(toResult(finding, subject, team, standard));
	}
	return results;
}
