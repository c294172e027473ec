/*
 * The rulebook on one size alone, as the calculator asks it: the feature's own rules under a
 * drawing made of what the caller states (units, standard, general tolerance, notes). The datum
 * letters the controls reference count as defined, since a lone size has no drawing to define
 * them on; a letter that is never used (I, O, Q on ASME) is still flagged.
 */
import type { GeometricControl, FeatureOverrides } from '../feature';
import { evaluate } from './evaluate';
import type { RulebookDrawing, RuleCode, Severity } from './types';

export interface SizeFinding {
	rule: RuleCode;
	severity: Severity;
	message: string;
	line: string;
}

export interface LoneSize {
	callout: string;
	internal: boolean;
	controls?: GeometricControl[];
	overrides?: FeatureOverrides;
	notes?: string;
}

/** The feature rules' findings on one size; an empty list when it is clean. */
export function sizeFindings(
	size: LoneSize,
	drawing: Omit<RulebookDrawing, 'datums'>
): SizeFinding[] {
	const datums: string[] = [];
	for (const c of size.controls ?? []) for (const d of c.datums) datums.push(d);
	const results = evaluate({
		drawing: { ...drawing, datums },
		features: [
			{
				id: 'size',
				kind: size.internal ? 'hole' : 'shaft',
				internal: size.internal,
				callout: size.callout,
				controls: size.controls,
				overrides: size.overrides,
				notes: size.notes
			}
		],
		fits: [],
		only: { featureIds: ['size'] }
	});
	return results.map((r) => ({
		rule: r.rule,
		severity: r.severity,
		message: r.message,
		line: r.line
	}));
}
