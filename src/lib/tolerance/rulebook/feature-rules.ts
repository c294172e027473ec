/*
 * Rules judged on one feature: limits (LIM), envelope (ENV-01…03), geometric tolerances (GEO),
 * notation (DOC). Fit membership comes in from the caller so LIM-05, ENV-02/03 and FIT-06 give
 * one result per feature however many fits it takes part in.
 */
import type { Tolerance } from '../callout-types';
import { parseDecimal, roundToPlaces, type Length } from '../decimal';
import { isAsme } from '../drawing-context';
import {
	ISO_ONLY_MODIFIERS,
	isSurfaceForm,
	type Characteristic,
	type GeometricControl
} from '../feature';
import { isoLimits, standardTolerance } from '../iso286';
import {
	LengthFormat,
	boundingControls,
	characteristicWord,
	show,
	signed,
	value,
	type FeatureContext
} from './context';
import type { Finding } from './emit';
import type { RulebookDrawing, RulebookFit, RulebookTeam } from './types';

export interface Membership {
	fit: RulebookFit;
	role: 'hole' | 'shaft';
}

export interface FeatureEnv {
	drawing: RulebookDrawing;
	team: RulebookTeam | undefined;
	datumLetters: { has(letter: string): boolean; list(): string[] };
	memberships: readonly Membership[];
}

const FORBIDDEN_DATUM_LETTERS = new Set(['I', 'O', 'Q']);
const LOCATING: readonly Characteristic[] = [
	'perpendicularity',
	'angularity',
	'parallelism',
	'position',
	'concentricity',
	'symmetry',
	'circular-runout',
	'total-runout',
	'profile-of-a-line',
	'profile-of-a-surface'
];
const NO_MATERIAL_MODIFIER: readonly Characteristic[] = [
	'circularity',
	'cylindricity',
	'circular-runout',
	'total-runout',
	'profile-of-a-line',
	'profile-of-a-surface'
];
const ISO_SIZE_MODIFIERS = new Set<string>(ISO_ONLY_MODIFIERS);

function zeroWidthMessage(message: string): boolean {
	return /equal|no tolerance/i.test(message);
}

/** A name per control that stays put when other controls are added: characteristic, then a count. */
function controlCauses(controls: readonly GeometricControl[]): string[] {
	const seen = new Map<string, number>();
	const causes: string[] = [];
	for (const c of controls) {
		const n = (seen.get(c.characteristic) ?? 0) + 1;
		seen.set(c.characteristic, n);
		causes.push(n === 1 ? c.characteristic : `${c.characteristic}#${n}`);
	}
	return causes;
}

function modifierSymbol(m: GeometricControl['modifier']): string {
	return m === 'mmc' ? ' Ⓜ' : m === 'lmc' ? ' Ⓛ' : '';
}

/** Deviations written so that the one in the upper place is below the one in the lower place. */
function invertedDeviations(callout: string, tolerance: Tolerance, units: 'mm' | 'in'): boolean {
	if (tolerance.type !== 'deviations') return false;
	const m = /([+\-−]?\s*\d*[.,]?\d+)\s*\/\s*([+\-−]?\s*\d*[.,]?\d+)/.exec(callout);
	if (!m) return false;
	const first = parseDecimal(m[1].replace(/\s+/g, ''), units);
	const second = parseDecimal(m[2].replace(/\s+/g, ''), units);
	return first !== null && second !== null && first.value < second.value;
}

function unequalPlaces(
	tolerance: Tolerance,
	nominalPlaces: number | null,
	inch: boolean
): string | null {
	if (tolerance.type === 'limits')
		return tolerance.lower.places !== tolerance.upper.places
			? `lower limit ${tolerance.lower.places} places, upper limit ${tolerance.upper.places}`
			: null;
	if (tolerance.type === 'bilateral')
		return inch && nominalPlaces !== null && nominalPlaces !== tolerance.deviation.places
			? `size ${nominalPlaces} places, tolerance ${tolerance.deviation.places}`
			: null;
	if (tolerance.type === 'deviations') {
		const { upper, lower } = tolerance;
		// Metric practice writes a nil deviation as a single 0.
		const bareZero =
			!inch &&
			((upper.value === 0 && upper.places === 0) || (lower.value === 0 && lower.places === 0));
		if (!bareZero && upper.places !== lower.places)
			return `upper deviation ${upper.places} places, lower ${lower.places}`;
		if (inch && nominalPlaces !== null && nominalPlaces !== upper.places)
			return `size ${nominalPlaces} places, tolerance ${upper.places}`;
	}
	return null;
}

/** The two limits a tolerance states beside an ISO class, with the places each was written with. */
function statedLimits(tolerance: Tolerance | null, nominal: Length) {
	if (!tolerance) return null;
	switch (tolerance.type) {
		case 'limits':
			return {
				lower: tolerance.lower.value,
				upper: tolerance.upper.value,
				lowerPlaces: tolerance.lower.places,
				upperPlaces: tolerance.upper.places
			};
		case 'deviations':
			return {
				lower: nominal + tolerance.lower.value,
				upper: nominal + tolerance.upper.value,
				lowerPlaces: tolerance.lower.places,
				upperPlaces: tolerance.upper.places
			};
		case 'bilateral':
			return {
				lower: nominal - tolerance.deviation.value,
				upper: nominal + tolerance.deviation.value,
				lowerPlaces: tolerance.deviation.places,
				upperPlaces: tolerance.deviation.places
			};
		default:
			return null;
	}
}

function agrees(stated: Length, iso: Length, places: number, units: 'mm' | 'in', up: boolean) {
	if (stated === iso) return true;
	if (stated === roundToPlaces(iso, units, places, up ? 'up' : 'down')) return true;
	return stated === roundToPlaces(iso, units, places, 'nearest');
}

export function featureRules(ctx: FeatureContext, env: FeatureEnv, out: Finding[]): void {
	const { feature, spec, evaluation: e } = ctx;
	const units = env.drawing.units;
	if (ctx.parseError) {
		const zero = zeroWidthMessage(ctx.parseError.message);
		out.push({
			rule: zero ? 'LIM-02' : 'LIM-01',
			cause: zero ? 'zero-width' : 'unreadable',
			message: zero
				? `The limits of ${feature.callout} leave no tolerance zone.`
				: `The callout ${feature.callout} cannot be read, so the feature has no limits.`,
			values: [
				value('callout', null, feature.callout),
				value('at character', null, String(ctx.parseError.position + 1))
			],
			line: `${ctx.parseError.message} (character ${ctx.parseError.position + 1})`,
			fix: zero
				? 'Give the size a zone of non-zero width.'
				: 'Correct the callout so it states the size and its tolerance.'
		});
		return;
	}
	if (!spec || !e) return;
	const thread = spec.kind === 'thread' || feature.kind === 'thread';
	const places = e.places;
	const f = new LengthFormat(units, places);

	if (!thread) limitRules(ctx, env, out, f);
	envelopeRules(ctx, out, f);
	geometricRules(ctx, env, out, thread);
	notationRules(ctx, out);
	if (!thread) memberRules(ctx, env, out, f);
}

function limitRules(ctx: FeatureContext, env: FeatureEnv, out: Finding[], f: LengthFormat) {
	const { feature } = ctx;
	const spec = ctx.spec!;
	const e = ctx.evaluation!;
	const units = env.drawing.units;
	const cls =
		spec.toleranceClass ?? (spec.fit ? (feature.internal ? spec.fit.hole : spec.fit.shaft) : null);
	const nominal = spec.nominal?.value ?? null;

	// LIM-04: the ISO 286 class itself.
	let classUndefined = false;
	if (cls) {
		if ((cls.feature === 'hole') !== feature.internal) {
			out.push({
				rule: 'LIM-04',
				cause: 'letter-case',
				message: `${cls.code} is a ${cls.feature} class on ${feature.internal ? 'an internal' : 'an external'} feature.`,
				values: [
					value('class', null, cls.code),
					value('feature', null, feature.internal ? 'internal' : 'external')
				],
				line: `${cls.code}: ${cls.feature === 'hole' ? 'capital letter = hole' : 'small letter = shaft'}, but the feature is ${feature.internal ? 'a hole' : 'a shaft'}`,
				fix: `Write the class in ${feature.internal ? 'capitals' : 'small letters'} (${feature.internal ? cls.code.toUpperCase() : cls.code.toLowerCase()}).`
			});
		}
		// A class alone that gave the limits is defined and states nothing to compare with.
		if (nominal !== null && !(spec.tolerance === null && e.limitsSource === 'iso286')) {
			const iso = isoLimits(nominal, cls.code);
			if (!iso.ok) {
				classUndefined = true;
				out.push({
					rule: 'LIM-04',
					cause: 'undefined',
					message: `${cls.code} is not defined at ${f.show(nominal)}.`,
					values: [value('class', null, cls.code), value('nominal size', nominal, f.show(nominal))],
					line: `${cls.code} at ${f.show(nominal)}: ${iso.reason}`,
					fix: 'Choose a tolerance class ISO 286 defines at this size, or write the limits.'
				});
			} else {
				const stated = statedLimits(spec.tolerance, nominal);
				if (
					stated &&
					!(
						agrees(stated.lower, iso.lower, stated.lowerPlaces, units, true) &&
						agrees(stated.upper, iso.upper, stated.upperPlaces, units, false)
					)
				) {
					const isoText = `${show(iso.lower, units, 3)}–${show(iso.upper, units, 3)}`;
					out.push({
						rule: 'LIM-04',
						cause: 'disagrees',
						message: `The limits written beside ${cls.code} are not the limits ${cls.code} gives.`,
						values: [
							value('stated lower', stated.lower, f.show(stated.lower)),
							value('stated upper', stated.upper, f.show(stated.upper)),
							value(`${cls.code} lower`, iso.lower, show(iso.lower, units, 3)),
							value(`${cls.code} upper`, iso.upper, show(iso.upper, units, 3))
						],
						line: `stated ${f.show(stated.lower)}–${f.show(stated.upper)}, ${cls.code} at ${f.show(nominal)} gives ${isoText} (ISO 286-2)`,
						fix: `Write ${isoText}, or drop one of the two statements.`
					});
				}
			}
		}
	}

	// LIM-02: inverted deviations (the parser refuses zero widths, handled above).
	if (spec.tolerance && invertedDeviations(feature.callout, spec.tolerance, units)) {
		out.push({
			rule: 'LIM-02',
			cause: 'inverted',
			message: 'The deviation written in the upper place is below the one in the lower place.',
			values: [value('callout', null, feature.callout)],
			line: `${feature.callout}: upper place ${signed(f.show(spec.tolerance.type === 'deviations' ? spec.tolerance.lower.value : 0))} below lower place ${signed(f.show(spec.tolerance.type === 'deviations' ? spec.tolerance.upper.value : 0))}`,
			fix: 'Write the larger deviation on top.'
		});
	}

	// LIM-03: places (ASME only).
	if (spec.tolerance && isAsme(ctx.standard)) {
		const why = unequalPlaces(spec.tolerance, spec.nominal?.places ?? null, units === 'in');
		if (why) {
			out.push({
				rule: 'LIM-03',
				cause: spec.tolerance.type,
				message: `${feature.callout} is written with unequal decimal places.`,
				values: [value('callout', null, feature.callout), value('places', null, why)],
				line: `${feature.callout}: ${why}`,
				fix: 'Add trailing zeros so both values carry the same number of places.'
			});
		}
	}

	// LIM-01 / DOC-01: no limits at all.
	if (e.limitsSource === 'none' && !classUndefined) {
		let cause: string;
		if (spec.kind === 'reference' || spec.kind === 'basic') cause = spec.kind;
		else if (nominal === null) cause = 'no-size';
		else if (!env.drawing.generalTolerance) cause = 'no-general-tolerance';
		else cause = 'not-covered';
		if (cause === 'no-general-tolerance') {
			out.push({
				rule: 'DOC-01',
				cause,
				message: `${feature.callout} relies on a general tolerance the drawing does not state.`,
				values: [
					value('nominal size', nominal, f.show(nominal!)),
					value('general tolerance', null, 'none stated')
				],
				line: `${f.show(nominal!)} without a tolerance; the drawing states no general tolerance`,
				fix: 'State the general tolerance on the drawing, or tolerance this size.'
			});
		} else {
			out.push({
				rule: 'LIM-01',
				cause,
				message: `${feature.label || feature.callout} has no limits of size.`,
				values: [value('callout', null, feature.callout), value('why', null, e.limitsNote)],
				line: `${feature.callout}: ${e.limitsNote}`,
				fix:
					cause === 'reference' || cause === 'basic'
						? 'Dimension the feature with a toleranced size, not a reference or basic one.'
						: 'Give the size its own tolerance.'
			});
		}
	}

	// LIM-06: tighter than the team's capability.
	const grade = env.team?.capabilityGrade;
	if (grade && e.tolerance !== null && e.tolerance > 0) {
		const size = nominal ?? e.lower ?? e.upper;
		const it = size !== null ? standardTolerance(size, grade) : null;
		if (it && it.ok && e.tolerance < it.value) {
			out.push({
				rule: 'LIM-06',
				cause: 'capability',
				message: `The size tolerance is tighter than ${it.grade}, the team's stated capability.`,
				values: [
					value('size tolerance', e.tolerance, f.show(e.tolerance)),
					value(`${it.grade} at this size`, it.value, show(it.value, units, 3))
				],
				line: `size tolerance ${f.show(e.tolerance)} < ${it.grade} ${show(it.value, units, 3)} at ${f.show(size!)} (ISO 286-1 table 1)`,
				fix: 'Open the tolerance to what the function needs, or agree the process with the shop.'
			});
		}
	}
}

function envelopeRules(ctx: FeatureContext, out: Finding[], f: LengthFormat) {
	const e = ctx.evaluation!;
	if (!e.envelope.applies || e.tolerance === null || e.controls.length === 0) return;
	const causes = controlCauses(ctx.feature.controls ?? []);
	for (let i = 0; i < e.controls.length; i++) {
		const c = e.controls[i];
		if (!isSurfaceForm(c.control) || c.value < e.tolerance) continue;
		out.push({
			rule: 'ENV-01',
			cause: causes[i],
			message: `The ${characteristicWord(c.control.characteristic)} ${f.show(c.value)} is not smaller than the size tolerance, so the envelope already enforces it.`,
			values: [
				value(characteristicWord(c.control.characteristic), c.value, f.show(c.value)),
				value('size tolerance', e.tolerance, f.show(e.tolerance))
			],
			line: `${characteristicWord(c.control.characteristic)} ${f.show(c.value)} ≥ size tolerance ${f.show(e.tolerance)} (${e.envelope.reason})`,
			fix: `Make the ${characteristicWord(c.control.characteristic)} smaller than ${f.show(e.tolerance)}, or remove it.`
		});
	}
}

function geometricRules(ctx: FeatureContext, env: FeatureEnv, out: Finding[], thread: boolean) {
	const e = ctx.evaluation!;
	const units = env.drawing.units;
	const controls = ctx.feature.controls ?? [];
	const edition2009 = ctx.standard === 'asme-y14.5-2009';
	// Only a finding needs the causes and words; most controls are fine.
	let causes: string[] | null = null;
	for (let i = 0; i < e.controls.length; i++) {
		const ce = e.controls[i];
		const c = ce.control;
		let t = '';
		let name = '';
		const modified = c.modifier !== 'rfs';
		const surface =
			NO_MATERIAL_MODIFIER.includes(c.characteristic) ||
			isSurfaceForm(c) ||
			(edition2009 && (c.characteristic === 'concentricity' || c.characteristic === 'symmetry'));
		if (modified && surface) {
			t = show(ce.value, units, e.places);
			name = characteristicWord(c.characteristic);
			causes ??= controlCauses(controls);
			out.push({
				rule: 'GEO-02',
				cause: causes[i],
				message: `${c.modifier.toUpperCase()} cannot apply to ${name}${isSurfaceForm(c) ? ' of a surface' : ''}.`,
				values: [value('control', null, `${name} ${t}${modifierSymbol(c.modifier)}`)],
				line: `${name} ${t}${modifierSymbol(c.modifier)}: ${name} controls surface elements, not a feature of size`,
				fix: `Remove the ${modifierSymbol(c.modifier).trim()}, or control the derived median line or axis instead.`
			});
		} else if (modified && !thread && (c.modifier === 'mmc' ? e.mmc === null : e.lmc === null)) {
			t = show(ce.value, units, e.places);
			name = characteristicWord(c.characteristic);
			causes ??= controlCauses(controls);
			out.push({
				rule: 'GEO-01',
				cause: causes[i],
				message: `${c.modifier.toUpperCase()} on a feature that has no ${c.modifier.toUpperCase()}.`,
				values: [
					value('control', null, `${name} ${t}${modifierSymbol(c.modifier)}`),
					value('why', null, e.limitsNote)
				],
				line: `${name} ${t}${modifierSymbol(c.modifier)} on ${ctx.feature.callout}: ${e.limitsNote}`,
				fix: 'Remove the modifier, or give the feature limits of size.'
			});
		}
		if (ce.value === 0 && !modified) {
			t = show(ce.value, units, e.places);
			name = characteristicWord(c.characteristic);
			causes ??= controlCauses(controls);
			out.push({
				rule: 'GEO-03',
				cause: causes[i],
				message: `A ${name} tolerance of zero regardless of feature size allows no deviation.`,
				values: [value('tolerance', 0, t), value('modifier', null, 'none (RFS)')],
				line: `${name} ${t} RFS: zero zone`,
				fix: 'Add Ⓜ for zero tolerancing at MMC, or give a value above zero.'
			});
		}
		const missing: string[] = [];
		const forbidden: string[] = [];
		for (const d of c.datums) {
			const letter = d.trim().toUpperCase();
			if (FORBIDDEN_DATUM_LETTERS.has(letter)) forbidden.push(letter);
			else if (!env.datumLetters.has(letter)) missing.push(letter);
		}
		if (missing.length || forbidden.length) {
			t = show(ce.value, units, e.places);
			name = characteristicWord(c.characteristic);
			causes ??= controlCauses(controls);
			const bad = [...forbidden, ...missing];
			out.push({
				rule: 'GEO-04',
				cause: `${causes[i]}:${bad.join('')}`,
				message: forbidden.length
					? `Datum letter ${forbidden.join(', ')} is not used (read as a digit).`
					: `Datum ${missing.join(', ')} is referenced but not defined on the drawing.`,
				values: [
					value('referenced', null, c.datums.join(' ')),
					value('defined', null, env.datumLetters.list().join(' ') || 'none')
				],
				line: `${name} ${t} references ${c.datums.join(' ')}; defined: ${env.datumLetters.list().join(' ') || 'none'}${forbidden.length ? `; ${forbidden.join(', ')} not allowed` : ''}`,
				fix: forbidden.length
					? 'Use another letter for the datum.'
					: `Define datum ${missing.join(', ')} on the drawing, or reference one that is.`
			});
		}
	}
	const own = ctx.feature.datumFeature?.trim().toUpperCase();
	if (own && FORBIDDEN_DATUM_LETTERS.has(own)) {
		out.push({
			rule: 'GEO-04',
			cause: `defines:${own}`,
			message: `Datum letter ${own} is not used (read as a digit).`,
			values: [value('datum letter', null, own)],
			line: `${ctx.feature.callout} defines datum ${own}; I, O and Q are not used`,
			fix: 'Use another letter for the datum.'
		});
	}
}

function notation(
	out: Finding[],
	standard: string,
	cause: string,
	what: string,
	why: string,
	fix: string
) {
	out.push({
		rule: 'DOC-02',
		cause,
		message: `${what} ${why}.`,
		values: [value('notation', null, what), value('standard', null, standard)],
		line: `${what}: ${why}`,
		fix
	});
}

function notationRules(ctx: FeatureContext, out: Finding[]) {
	const spec = ctx.spec!;
	const controls = ctx.feature.controls ?? [];
	const standard = ctx.standard;
	if (standard === 'asme-y14.5-2018' && controls.length) {
		const causes = controlCauses(controls);
		for (let i = 0; i < controls.length; i++) {
			const c = controls[i].characteristic;
			if (c === 'concentricity' || c === 'symmetry')
				notation(
					out,
					standard,
					causes[i],
					characteristicWord(c),
					'was removed from ASME Y14.5 in the 2018 edition',
					'Use position, profile or run-out instead.'
				);
		}
	}
	if (
		standard === 'iso-8015' &&
		(spec.modifiers.includes('independency') || ctx.feature.overrides?.independency)
	)
		notation(
			out,
			standard,
			'independency',
			'Ⓘ',
			'is ASME notation; ISO 8015 is independent by default',
			'Remove Ⓘ; without Ⓔ the ISO size is independent already.'
		);
	if (isAsme(standard)) {
		let iso: string | null = null;
		for (const m of spec.modifiers)
			if (ISO_SIZE_MODIFIERS.has(m))
				iso = iso === 'Ⓔ' || m === 'envelope' ? 'Ⓔ' : 'ISO 14405 size modifier';
		if (iso)
			notation(
				out,
				standard,
				'iso-size-modifier',
				iso,
				'is ISO notation on an ASME Y14.5 drawing',
				'Remove it: Rule #1 already gives the envelope under ASME Y14.5.'
			);
		if (spec.decimalSeparator === ',')
			notation(
				out,
				standard,
				'decimal-comma',
				'decimal comma',
				'is not ASME Y14.5 notation',
				'Write a decimal point.'
			);
	}
}

function fitList(env: FeatureEnv): string {
	const ids: string[] = [];
	for (const m of env.memberships) ids.push(m.fit.id);
	return ids.join(', ');
}

function memberRules(ctx: FeatureContext, env: FeatureEnv, out: Finding[], f: LengthFormat) {
	if (env.memberships.length === 0) return;
	const e = ctx.evaluation!;
	const { feature } = ctx;
	const first = env.memberships[0].fit;

	// LIM-05: one limit open on a fit member.
	if (e.limitsSource === 'callout' && (e.upper === null) !== (e.lower === null)) {
		const mmcMissing = e.mmc === null;
		out.push({
			rule: 'LIM-05',
			cause: mmcMissing ? 'mmc-side' : 'lmc-side',
			message: mmcMissing
				? `A fit member with no limit on the MMC side: assembly is not guaranteed.`
				: `A fit member with no limit on the LMC side: the looseness of the fit is unbounded.`,
			values: [
				value('MMC', e.mmc, e.mmc === null ? 'open' : f.show(e.mmc)),
				value('LMC', e.lmc, e.lmc === null ? 'open' : f.show(e.lmc)),
				value('fits', null, fitList(env))
			],
			line: `${feature.callout}: MMC ${e.mmc === null ? 'open' : f.show(e.mmc)}, LMC ${e.lmc === null ? 'open' : f.show(e.lmc)}; member of ${fitList(env)}`,
			fix: 'Give the fit member both limits.'
		});
	}

	// ENV-02 / ENV-03: nothing bounds the mating envelope.
	const bounded = e.envelope.applies || boundingControls(e).length > 0;
	if (!bounded && e.mmc !== null) {
		if (ctx.standard === 'iso-8015') {
			out.push({
				rule: 'ENV-02',
				cause: 'unbounded',
				message: `Nothing bounds the mating envelope of this fit member (ISO 8015 independency).`,
				values: [
					value('MMC', e.mmc, f.show(e.mmc)),
					value('envelope', null, e.envelope.reason),
					value('fits', null, fitList(env))
				],
				line: `${feature.callout}: two-point sizes only, form unbounded; MMC ${f.show(e.mmc)} does not bound the mating size (${first.intent} fit ${first.id})`,
				fix: `Add Ⓔ to the size, or a geometric tolerance at MMC that bounds it.`
			});
		} else if (isAsme(ctx.standard)) {
			out.push({
				rule: 'ENV-03',
				cause: 'unbounded',
				message: `Rule #1 is lifted on this fit member and nothing else bounds its mating envelope.`,
				values: [
					value('MMC', e.mmc, f.show(e.mmc)),
					value('envelope', null, e.envelope.reason),
					value('fits', null, fitList(env))
				],
				line: `${feature.callout}: ${e.envelope.reason}; no boundary at MMC (${first.intent} fit ${first.id})`,
				fix: 'Remove the exemption, or add a geometric tolerance at MMC that makes a virtual condition.'
			});
		}
	}

	// FIT-06: nothing relates the member to the rest of the part.
	const general = env.drawing.generalTolerance;
	const generalGeometric =
		general?.kind === 'iso2768' && !!general.geometric && !isAsme(ctx.standard);
	let located = false;
	for (const c of feature.controls ?? []) if (LOCATING.includes(c.characteristic)) located = true;
	if (!located && !generalGeometric && !feature.datumFeature) {
		out.push({
			rule: 'FIT-06',
			cause: 'unlocated',
			message: 'A fit member with no orientation or location control.',
			values: [
				value(
					'controls',
					null,
					(feature.controls ?? []).map((c) => characteristicWord(c.characteristic)).join(', ') ||
						'none'
				),
				value('fits', null, fitList(env))
			],
			line: `${feature.callout}: no position, orientation or run-out control, and no general geometric tolerance; member of ${fitList(env)}`,
			fix: 'Add a position or orientation tolerance to the appropriate datums.'
		});
	}
}
