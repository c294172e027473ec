/*
 * What the rules read about one feature: its callout as parsed, the feature evaluation from
 * ../feature.ts, and the standard it is judged under. Built once per feature per run.
 */
import { parseCallout } from '../callout';
import type { CalloutSpec } from '../callout-types';
import { formatLength, type Length, type Units } from '../decimal';
import {
	effectiveStandard,
	exactPlaces,
	featureValues,
	isSurfaceForm,
	type FeatureValues,
	type GoverningStandard
} from '../feature';
import type { ResultValue, RulebookDrawing, RulebookFeature } from './types';

export interface FeatureContext {
	feature: RulebookFeature;
	/** The drawing the feature sits on: its own when it has one, else the drawing judged. */
	drawing: RulebookDrawing;
	index: number;
	spec: CalloutSpec | null;
	parseError: { message: string; position: number } | null;
	/** The exact values only: the rules write their own text. */
	evaluation: FeatureValues | null;
	/** The callout was read and evaluated. */
	ok: boolean;
	standard: GoverningStandard;
	/** ISO notation made the standard ISO 8015 on a drawing that states none. */
	assumed: boolean;
}

export function featureContext(
	feature: RulebookFeature,
	index: number,
	judged: RulebookDrawing
): FeatureContext {
	const drawing = feature.drawing ?? judged;
	const parsed = parseCallout(feature.callout ?? '', { units: drawing.units });
	if (!parsed.ok)
		return {
			feature,
			drawing,
			index,
			spec: null,
			parseError: { message: parsed.message, position: parsed.position },
			evaluation: null,
			ok: false,
			standard: drawing.standard,
			assumed: false
		};
	const spec = parsed.spec;
	const notes = feature.notes
		? drawing.notes
			? `${drawing.notes}\n${feature.notes}`
			: feature.notes
		: drawing.notes;
	const evaluation = featureValues({
		spec,
		internal: feature.internal,
		units: drawing.units,
		standard: drawing.standard,
		generalTolerance: drawing.generalTolerance,
		controls: feature.controls,
		overrides: feature.overrides,
		notes
	});
	const { standard, assumed } = effectiveStandard(drawing.standard, spec, drawing.generalTolerance);
	return {
		feature,
		drawing,
		index,
		spec,
		parseError: null,
		evaluation: evaluation.ok ? evaluation : null,
		ok: evaluation.ok,
		standard,
		assumed
	};
}

/** Shows lengths in one unit with at least `places` decimals, more where a value needs them. */
export class LengthFormat {
	constructor(
		readonly units: Units,
		readonly places: number
	) {}
	show(value: Length): string {
		return show(value, this.units, this.places);
	}
}

/** A length in the feature's unit with enough places to show it exactly. */
export function show(value: Length, units: Units, places: number): string {
	return formatLength(value, units, Math.max(places, exactPlaces(value, units)));
}

export function value(name: string, length: Length | null, text: string): ResultValue {
	return { name, text, length };
}

/** Lengths in a readable line: a true minus sign for negatives. */
export function signed(text: string): string {
	return text.startsWith('-') ? `−${text.slice(1)}` : text;
}

export function memberWord(feature: RulebookFeature): string {
	if (feature.kind === 'pin' || feature.kind === 'shaft' || feature.kind === 'slot')
		return feature.kind;
	if (feature.kind === 'bore') return 'bore';
	return feature.internal ? 'hole' : 'shaft';
}

/** Controls that make a boundary for the mating envelope (not surface form controls). */
export function boundingControls(e: FeatureValues): FeatureValues['controls'] {
	const out: FeatureValues['controls'] = [];
	for (const c of e.controls) if (c.boundaries !== null && !isSurfaceForm(c.control)) out.push(c);
	return out;
}

export function characteristicWord(c: string): string {
	return c.replaceAll('-', ' ');
}
