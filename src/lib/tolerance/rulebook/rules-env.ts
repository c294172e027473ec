/*
 * ENV: the envelope and the governing standard (PRODUCT.md §5). ENV-02/03 are judged on fit
 * members only; ENV-04 on the drawing.
 */
import type { RulebookDrawing } from './types';
import { isAsme } from '../drawing-context';
import { isSurfaceForm } from '../feature';
import {
	LengthFormat,
	boundingControls,
	characteristicWord,
	value,
	type FeatureContext
} from './context';
import type { Finding } from './emit';
import { controlCauses, fitList, type FeatureEnv } from './feature-env';

/** ENV-01: a form control the envelope already enforces. */
export function envelopeRules(ctx: FeatureContext, out: Finding[], f: LengthFormat): void {
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

/** ENV-02 / ENV-03: nothing bounds a fit member's mating envelope. */
export function memberEnvelopeRules(
	ctx: FeatureContext,
	env: FeatureEnv,
	out: Finding[],
	f: LengthFormat
): void {
	if (env.memberships.length === 0) return;
	const e = ctx.evaluation!;
	const bounded = e.envelope.applies || boundingControls(e).length > 0;
	if (bounded || e.mmc === null) return;
	const first = env.memberships[0].fit;
	const callout = ctx.feature.callout;
	const values = [
		value('MMC', e.mmc, f.show(e.mmc)),
		value('envelope', null, e.envelope.reason),
		value('fits', null, fitList(env))
	];
	if (ctx.standard === 'iso-8015') {
		out.push({
			rule: 'ENV-02',
			cause: 'unbounded',
			message: `Nothing bounds the mating envelope of this fit member (ISO 8015 independency).`,
			values,
			line: `${callout}: two-point sizes only, form unbounded; MMC ${f.show(e.mmc)} does not bound the mating size (${first.intent} fit ${first.id})`,
			fix: `Add Ⓔ to the size, or a geometric tolerance at MMC that bounds it.`
		});
	} else if (isAsme(ctx.standard)) {
		out.push({
			rule: 'ENV-03',
			cause: 'unbounded',
			message: `Rule #1 is lifted on this fit member and nothing else bounds its mating envelope.`,
			values,
			line: `${callout}: ${e.envelope.reason}; no boundary at MMC (${first.intent} fit ${first.id})`,
			fix: 'Remove the exemption, or add a geometric tolerance at MMC that makes a virtual condition.'
		});
	}
}

/** ENV-04: no governing standard stated. */
export function standardRule(
	drawing: RulebookDrawing,
	contexts: () => Iterable<FeatureContext>,
	out: Finding[]
): void {
	if (drawing.standard !== 'unstated') return;
	let iso = drawing.generalTolerance?.kind === 'iso2768';
	if (!iso) for (const c of contexts()) if (c.assumed) iso = true;
	out.push({
		rule: 'ENV-04',
		cause: iso ? 'iso-assumed' : 'undetermined',
		message: iso
			? 'No governing standard is stated; ISO GPS notation is present, so ISO 8015 is assumed.'
			: 'No governing standard is stated, so whether the envelope applies is undetermined.',
		values: [
			value('standard', null, 'unstated'),
			value('ISO notation', null, iso ? 'present' : 'none')
		],
		line: iso
			? 'standard unstated; ISO notation present → ISO 8015 by invocation (independency)'
			: 'standard unstated; no ISO notation → envelope (Rule #1) or independency undetermined',
		fix: 'State the governing standard in the title block.'
	});
}
