/*
 * DOC: drawing notes and notation (PRODUCT.md §5): a general tolerance relied on but not stated
 * (DOC-01), notation of the wrong system or edition, and withdrawn references (DOC-02).
 */
import { isAsme } from '../drawing-context';
import { ISO_ONLY_MODIFIERS } from '../feature';
import { ISO_2768_2_STATUS } from '../iso2768';
import { LengthFormat, characteristicWord, value, type FeatureContext } from './context';
import type { Finding } from './emit';
import { controlCauses, type FeatureEnv } from './feature-env';
import { missingLimitsCause } from './rules-lim';
import type { RulebookDrawing } from './types';

const ISO_SIZE_MODIFIERS = new Set<string>(ISO_ONLY_MODIFIERS);

/** DOC-01: a size that relies on a general tolerance the drawing does not state. */
export function generalToleranceRule(
	ctx: FeatureContext,
	env: FeatureEnv,
	out: Finding[],
	f: LengthFormat
): void {
	if (missingLimitsCause(ctx) !== 'no-general-tolerance') return;
	const nominal = ctx.spec!.nominal!.value;
	out.push({
		rule: 'DOC-01',
		cause: 'no-general-tolerance',
		message: `${ctx.feature.callout} relies on a general tolerance the drawing does not state.`,
		values: [
			value('nominal size', nominal, f.show(nominal)),
			value('general tolerance', null, 'none stated')
		],
		line: `${f.show(nominal)} without a tolerance; the drawing states no general tolerance`,
		fix: 'State the general tolerance on the drawing, or tolerance this size.'
	});
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

/** ISO size modifiers on an ASME drawing, and the decimal comma. */
function isoNotationOnAsme(ctx: FeatureContext, out: Finding[]): void {
	const spec = ctx.spec!;
	const standard = ctx.standard;
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

/** DOC-02 on one feature: notation the drawing's standard or edition does not have. */
export function notationRules(ctx: FeatureContext, out: Finding[]): void {
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
	if (isAsme(standard)) isoNotationOnAsme(ctx, out);
}

/** DOC-02 on the drawing: a withdrawn ISO 2768-2 reference, an ISO general note on ASME. */
export function drawingNotationRules(drawing: RulebookDrawing, out: Finding[]): void {
	const g = drawing.generalTolerance;
	if (g?.kind !== 'iso2768') return;
	if (g.geometric) {
		out.push({
			rule: 'DOC-02',
			cause: 'withdrawn-iso-2768-2',
			message: `ISO 2768-${g.linear}${g.geometric} cites ISO 2768-2 (class ${g.geometric}), withdrawn in ${ISO_2768_2_STATUS.withdrawn}.`,
			values: [
				value(
					'general tolerance',
					null,
					`ISO 2768-${g.linear}${g.geometric}${g.envelope ? '-E' : ''}`
				),
				value('replaced by', null, ISO_2768_2_STATUS.replacedBy)
			],
			line: `ISO 2768-${g.linear}${g.geometric}: ISO 2768-2 withdrawn ${ISO_2768_2_STATUS.withdrawn}, replaced by ${ISO_2768_2_STATUS.replacedBy}`,
			fix: `Cite ${ISO_2768_2_STATUS.replacedBy} general geometric specifications, or keep the reference knowingly.`
		});
	}
	if (isAsme(drawing.standard)) {
		out.push({
			rule: 'DOC-02',
			cause: 'iso-general-on-asme',
			message: 'An ISO 2768 general tolerance on an ASME Y14.5 drawing.',
			values: [
				value('general tolerance', null, `ISO 2768-${g.linear}`),
				value('standard', null, drawing.standard)
			],
			line: `ISO 2768-${g.linear} with ${drawing.standard}`,
			fix: 'State the general tolerance in the system of the drawing.'
		});
	}
}
