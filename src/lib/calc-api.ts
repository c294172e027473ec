/*
 * The calc API's JSON (PRODUCT.md §6): decimal strings in the callout's unit, field names fixed
 * by the public contract. Shared by the routes and their tests.
 */
import { error } from '@sveltejs/kit';
import type { z } from 'zod';
import { parseOrRefuse } from '$lib/server/api-input';
import { CAUTION, adviseInput, fitInput, sizeInput, sizeQuery } from '$lib/schemas/calc';
import { formatCallout } from '$lib/tolerance/callout-format';
import { evaluateFeature, type FeatureEvaluation } from '$lib/tolerance/feature';
import { evaluateFit, type FitEvaluation, type FitMemberInput } from '$lib/tolerance/fit';
import { adviseFit } from '$lib/tolerance/fit-advisor';
import { sizeFindings, type SizeFinding } from '$lib/tolerance/rulebook';

export function invalid(message: string, extra: Record<string, unknown> = {}): never {
	const body = { message, code: 'invalid', ...extra };
	error(400, body);
}

/** The size and what the rulebook says about it: `findings` is empty when it is clean. */
export function sizeJson(f: FeatureEvaluation, findings: SizeFinding[] = []) {
	const controls = f.controls.map((c) => ({
		characteristic: c.control.characteristic,
		value: c.text.value,
		diameterZone: c.control.diameterZone,
		appliesTo: c.control.appliesTo,
		modifier: c.control.modifier,
		datums: c.control.datums,
		...(c.boundaries
			? {
					...(c.control.modifier !== 'rfs'
						? {
								virtualCondition: c.text.virtualCondition,
								resultantCondition: c.text.resultantCondition
							}
						: {}),
					innerBoundary: c.text.innerBoundary,
					outerBoundary: c.text.outerBoundary
				}
			: {}),
		...(c.bonus ? { bonus: c.text.bonus, allowed: c.text.allowed } : {}),
		...(c.note ? { note: c.note } : {})
	}));
	// With one bounded control the boundaries also sit on the size itself, as the contract names them.
	const bounded = controls.filter((c) => 'innerBoundary' in c);
	const first = bounded.length === 1 ? bounded[0] : null;
	return {
		callout: formatCallout(f.spec),
		units: f.units,
		internal: f.internal,
		limitsSource: f.limitsSource,
		limitsNote: f.limitsNote,
		upper: f.text.upper,
		lower: f.text.lower,
		tolerance: f.text.tolerance,
		mmc: f.text.mmc,
		lmc: f.text.lmc,
		envelope: f.envelope,
		gauges: {
			go: f.text.go,
			noGo: f.text.noGo,
			...(f.gauges.note ? { note: f.gauges.note } : {})
		},
		formDeviation: f.text.formDeviation,
		...(first
			? {
					...('virtualCondition' in first
						? {
								virtualCondition: first.virtualCondition,
								resultantCondition: first.resultantCondition
							}
						: {}),
					innerBoundary: first.innerBoundary,
					outerBoundary: first.outerBoundary
				}
			: {}),
		geometric: controls,
		...(f.actual ? { actual: { size: f.text.actual, withinLimits: f.actual.withinLimits } } : {}),
		findings: findings.map(findingJson)
	};
}

/** One rulebook result as the answers carry it. */
export function findingJson({ rule, severity, message, line }: SizeFinding) {
	return { rule, severity, message, line };
}

export function fitJson(
	fit: FitEvaluation,
	findings: { hole: SizeFinding[]; shaft: SizeFinding[] } = { hole: [], shaft: [] }
) {
	const boundaries = fit.hole.controls.length > 0 || fit.shaft.controls.length > 0;
	return {
		...(fit.shaftLimits.converted
			? {
					// The other member's limits in the hole's unit, converted inward.
					[`${fit.memberKind}InHoleUnits`]: fit.text.shaft
				}
			: {}),
		units: fit.units,
		intent: fit.intent,
		hole: sizeJson(fit.hole, findings.hole),
		[fit.memberKind]: sizeJson(fit.shaft, findings.shaft),
		minClearance: fit.text.minClearance,
		maxClearance: fit.text.maxClearance,
		classification: fit.classification,
		...(boundaries
			? {
					sharedDatumFrame: fit.sharedDatumFrame,
					countedControls: fit.text.countedControls,
					minClearanceAtBoundary: fit.text.minClearanceAtBoundary,
					maxClearanceAtBoundary: fit.text.maxClearanceAtBoundary,
					...(fit.boundaryNote ? { boundaryNote: fit.boundaryNote } : {})
				}
			: {}),
		verdict: fit.verdict,
		checks: fit.checks,
		...(fit.fastener
			? {
					fastenerBudget: {
						formula: fit.fastener.formula,
						H: fit.text.fastener?.H,
						F: fit.text.fastener?.F,
						available: fit.text.fastener?.available,
						used: fit.text.fastener?.used,
						required: fit.text.fastener?.required,
						ok: fit.fastener.ok,
						modifier: fit.fastener.modifier,
						boundary: fit.fastener.boundary,
						holeTooSmall: fit.fastener.holeTooSmall,
						rule: fit.fastener.text
					}
				}
			: {}),
		...(fit.temperature
			? {
					temperature: {
						operating: fit.temperature.operating,
						minClearance: fit.text.temperature?.minClearance,
						maxClearance: fit.text.temperature?.maxClearance,
						classification: fit.temperature.classification,
						checks: fit.checks.filter((c) => c.what.startsWith('at '))
					}
				}
			: {}),
		caution: CAUTION
	};
}

/** GET query or POST body of /api/v1/calc/size → the size object. Throws 400 on bad input. */
export function calcSize(data: unknown, from: 'query' | 'body') {
	const input = parseOrRefuse(from === 'query' ? sizeQuery : sizeInput, data) as z.output<
		typeof sizeInput
	>;
	const result = evaluateFeature({
		callout: input.callout,
		internal: input.feature === undefined ? undefined : input.feature === 'internal',
		units: input.units,
		standard: input.standard,
		generalTolerance: input.generalTolerance,
		controls: input.geometric,
		overrides: input.overrides,
		notes: input.notes,
		actual: input.actual
	});
	if (!result.ok) failed(result.message, result.field, result.position);
	const findings = sizeFindings(
		{
			callout: input.callout,
			internal: result.internal,
			controls: input.geometric,
			overrides: input.overrides,
			notes: input.notes
		},
		{
			units: input.units,
			standard: input.standard,
			generalTolerance: input.generalTolerance ?? null
		}
	);
	return { ...sizeJson(result, findings), standard: input.standard, caution: CAUTION };
}

type FitBody = z.output<typeof fitInput>;

/** A member as the core takes it: on its own drawing when it names a standard or general tolerance. */
function memberInput(m: FitBody['hole'], fit: FitBody): FitMemberInput {
	const own = m.standard !== undefined || m.generalTolerance !== undefined;
	return {
		callout: m.callout,
		units: m.units,
		controls: m.geometric,
		overrides: m.overrides,
		notes: m.notes,
		drawing: own
			? {
					units: m.units ?? fit.units,
					standard: m.standard ?? fit.standard,
					generalTolerance:
						m.generalTolerance !== undefined ? m.generalTolerance : fit.generalTolerance
				}
			: undefined
	};
}

/** The rulebook on one member, under its own drawing's context or the fit's. */
function memberFindings(m: FitBody['hole'], internal: boolean, fit: FitBody): SizeFinding[] {
	return sizeFindings(
		{ callout: m.callout, internal, controls: m.geometric, overrides: m.overrides, notes: m.notes },
		{
			units: m.units ?? fit.units,
			standard: m.standard ?? fit.standard,
			generalTolerance:
				(m.generalTolerance !== undefined ? m.generalTolerance : fit.generalTolerance) ?? null
		}
	);
}

export function calcFit(data: unknown) {
	const input = parseOrRefuse(fitInput, data);
	const result = evaluateFit({
		hole: memberInput(input.hole, input),
		shaft: input.shaft ? memberInput(input.shaft, input) : undefined,
		fastener: input.fastener,
		units: input.units,
		standard: input.standard,
		generalTolerance: input.generalTolerance,
		intent: input.intent,
		sharedDatumFrame: input.sharedDatumFrame,
		requiredMinClearance: input.requiredMinClearance,
		requiredMaxClearance: input.requiredMaxClearance,
		temperature: input.temperature
	});
	if (!result.ok) {
		const where = result.member === 'fit' ? result.field : `${result.member}.${result.field}`;
		failed(result.message, where, result.position);
	}
	const findings = {
		hole: memberFindings(input.hole, true, input),
		shaft: input.shaft ? memberFindings(input.shaft, false, input) : []
	};
	return { ...fitJson(result, findings), standard: input.standard };
}

export function calcAdvise(data: unknown) {
	const input = parseOrRefuse(adviseInput, data);
	const result = adviseFit(input);
	if (!result.ok) invalid(result.message, { field: 'basicSize' });
	const { ok: _ok, ...proposals } = result;
	return { ...proposals, caution: CAUTION };
}

function failed(message: string, field: string, position: number | null): never {
	invalid(message, position === null ? { field } : { field, position });
}
