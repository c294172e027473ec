/*
 * GEO: geometric tolerances (PRODUCT.md §5): material modifiers where they cannot apply or have
 * nothing to refer to, zero tolerances without Ⓜ, and datum letters.
 */
import { isAsme } from '../drawing-context';
import type { Characteristic, GeometricControl } from '../feature';
import { ZERO } from '../decimal';
import { isSurfaceForm } from '../feature';
import { characteristicWord, show, value, type FeatureContext } from './context';
import type { Finding } from './emit';
import { controlCauses, type FeatureEnv } from './feature-env';

/** ASME Y14.5 does not use I, O and Q as datum letters (read as digits); ISO 5459 has no such ban. */
const FORBIDDEN_DATUM_LETTERS = new Set(['I', 'O', 'Q']);
const NO_MATERIAL_MODIFIER: readonly Characteristic[] = [
	'circularity',
	'cylindricity',
	'circular-runout',
	'total-runout',
	'profile-of-a-line',
	'profile-of-a-surface'
];

function modifierSymbol(m: GeometricControl['modifier']): string {
	return m === 'mmc' ? ' Ⓜ' : m === 'lmc' ? ' Ⓛ' : '';
}

/** One control's words, made only when a finding needs them (most controls are fine). */
class ControlWords {
	private causes: string[] | null = null;
	constructor(private ctx: FeatureContext) {}
	cause(i: number): string {
		this.causes ??= controlCauses(this.ctx.feature.controls ?? []);
		return this.causes[i];
	}
	value(i: number): string {
		const e = this.ctx.evaluation!;
		return show(e.controls[i].value, this.ctx.drawing.units, e.places);
	}
}

/** GEO-01 / GEO-02: a material modifier where it cannot apply, or with nothing to refer to. */
function modifierRules(
	ctx: FeatureContext,
	i: number,
	words: ControlWords,
	thread: boolean,
	out: Finding[]
): void {
	const e = ctx.evaluation!;
	const c = e.controls[i].control;
	if (c.modifier === 'rfs') return;
	const edition2009 = ctx.standard === 'asme-y14.5-2009';
	const medianPoints =
		edition2009 && (c.characteristic === 'concentricity' || c.characteristic === 'symmetry');
	const surface =
		NO_MATERIAL_MODIFIER.includes(c.characteristic) || isSurfaceForm(c) || medianPoints;
	const name = characteristicWord(c.characteristic);
	const symbol = modifierSymbol(c.modifier);
	const modifier = c.modifier.toUpperCase();
	if (surface) {
		out.push({
			rule: 'GEO-02',
			cause: words.cause(i),
			message: `${modifier} cannot apply to ${name}${isSurfaceForm(c) ? ' of a surface' : ''}.`,
			values: [value('control', null, `${name} ${words.value(i)}${symbol}`)],
			line: medianPoints
				? `${name} ${words.value(i)}${symbol}: ${name} controls the median points of the feature and applies regardless of feature size only (ASME Y14.5-2009)`
				: `${name} ${words.value(i)}${symbol}: ${name} controls surface elements, not a feature of size`,
			fix: medianPoints
				? `Remove the ${symbol.trim()}, or use position at MMC where a bonus is wanted.`
				: `Remove the ${symbol.trim()}, or control the derived median line or axis instead.`
		});
	} else if (!thread && (c.modifier === 'mmc' ? e.mmc === null : e.lmc === null)) {
		out.push({
			rule: 'GEO-01',
			cause: words.cause(i),
			message: `${modifier} on a feature that has no ${modifier}.`,
			values: [
				value('control', null, `${name} ${words.value(i)}${symbol}`),
				value('why', null, e.limitsNote)
			],
			line: `${name} ${words.value(i)}${symbol} on ${ctx.feature.callout}: ${e.limitsNote}`,
			fix: 'Remove the modifier, or give the feature limits of size.'
		});
	}
}

/** GEO-03: a zero tolerance regardless of feature size. */
function zeroRule(ctx: FeatureContext, i: number, words: ControlWords, out: Finding[]): void {
	const ce = ctx.evaluation!.controls[i];
	if (ce.value !== 0 || ce.control.modifier !== 'rfs') return;
	const name = characteristicWord(ce.control.characteristic);
	const t = words.value(i);
	out.push({
		rule: 'GEO-03',
		cause: words.cause(i),
		message: `A ${name} tolerance of zero regardless of feature size allows no deviation.`,
		values: [value('tolerance', ZERO, t), value('modifier', null, 'none (RFS)')],
		line: `${name} ${t} RFS: zero zone`,
		fix: 'Add Ⓜ for zero tolerancing at MMC, or give a value above zero.'
	});
}

/** GEO-04: datum letters referenced but not defined, or not used at all (I, O, Q). */
function datumRule(
	ctx: FeatureContext,
	env: FeatureEnv,
	i: number,
	words: ControlWords,
	out: Finding[]
): void {
	const c = ctx.evaluation!.controls[i].control;
	const missing: string[] = [];
	const forbidden: string[] = [];
	const asme = isAsme(ctx.standard);
	for (const d of c.datums) {
		const letter = d.trim().toUpperCase();
		if (asme && FORBIDDEN_DATUM_LETTERS.has(letter)) forbidden.push(letter);
		else if (!env.datumLetters.has(letter)) missing.push(letter);
	}
	if (!missing.length && !forbidden.length) return;
	const name = characteristicWord(c.characteristic);
	const defined = env.datumLetters.list().join(' ') || 'none';
	out.push({
		rule: 'GEO-04',
		cause: `${words.cause(i)}:${[...forbidden, ...missing].join('')}`,
		message: forbidden.length
			? `Datum letter ${forbidden.join(', ')} is not used (read as a digit).`
			: `Datum ${missing.join(', ')} is referenced but not defined on the drawing.`,
		values: [value('referenced', null, c.datums.join(' ')), value('defined', null, defined)],
		line: `${name} ${words.value(i)} references ${c.datums.join(' ')}; defined: ${defined}${forbidden.length ? `; ${forbidden.join(', ')} not allowed` : ''}`,
		fix: forbidden.length
			? 'Use another letter for the datum.'
			: `Define datum ${missing.join(', ')} on the drawing, or reference one that is.`
	});
}

/** GEO-04 on the letter the feature itself defines. */
function ownDatumRule(ctx: FeatureContext, out: Finding[]): void {
	const own = ctx.feature.datumFeature?.trim().toUpperCase();
	if (!own || !isAsme(ctx.standard) || !FORBIDDEN_DATUM_LETTERS.has(own)) return;
	out.push({
		rule: 'GEO-04',
		cause: `defines:${own}`,
		message: `Datum letter ${own} is not used (read as a digit).`,
		values: [value('datum letter', null, own)],
		line: `${ctx.feature.callout} defines datum ${own}; I, O and Q are not used`,
		fix: 'Use another letter for the datum.'
	});
}

/** The GEO rules of one readable feature. */
export function geometricRules(
	ctx: FeatureContext,
	env: FeatureEnv,
	out: Finding[],
	thread: boolean
): void {
	const n = ctx.evaluation!.controls.length;
	if (n > 0) {
		const words = new ControlWords(ctx);
		for (let i = 0; i < n; i++) {
			modifierRules(ctx, i, words, thread, out);
			zeroRule(ctx, i, words, out);
			datumRule(ctx, env, i, words, out);
		}
	}
	ownDatumRule(ctx, out);
}
