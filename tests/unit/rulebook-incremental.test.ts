/*
 * A run limited to what one edit touched gives, for every subject it judges, exactly what a
 * full run gives for it.
 */
import { describe, expect, it } from 'vitest';
import { evaluate, indexRulebook, scopeOf } from '../../src/lib/tolerance/rulebook';
import type { RuleResult, RulebookInput } from '../../src/lib/tolerance/rulebook';
import { bracket, pumpAssembly } from './fixtures/demo-drawings';

function inScope(results: RuleResult[], input: RulebookInput): RuleResult[] {
	const scope = scopeOf(input);
	const features = new Set(scope.featureIds);
	const fits = new Set(scope.fitIds);
	return results.filter((r) =>
		r.subject === 'drawing'
			? scope.drawing
			: r.subject === 'feature'
				? features.has(r.featureId!)
				: fits.has(r.fitId!)
	);
}

function check(input: RulebookInput) {
	const full = evaluate({ ...input, only: undefined });
	const part = evaluate(input);
	expect(part).toEqual(inScope(full, input));
	return part;
}

describe('incremental runs', () => {
	const base = { ...pumpAssembly, only: undefined };

	it('a touched feature brings the fits that reference it and their other members', () => {
		const input = { ...base, only: { featureIds: ['kf1002-journal'] } };
		expect(scopeOf(input)).toEqual({
			drawing: false,
			featureIds: ['kf1002-journal', 'kf1003-bore'],
			fitIds: ['fit-journal']
		});
		const part = check(input);
		// Both members are their drawings' datum A, so no FIT-06; the bore has no Ⓔ.
		expect(part.map((r) => r.rule)).toEqual(['ENV-02', 'FIT-02']);
	});

	it('for every single feature and every single fit of the demo', () => {
		for (const f of base.features) check({ ...base, only: { featureIds: [f.id] } });
		for (const f of base.fits) check({ ...base, only: { fitIds: [f.id] } });
		for (const f of bracket.features) check({ ...bracket, only: { featureIds: [f.id] } });
		check({ ...base, only: { drawing: true } });
	});

	it('with a kept index, after an edit in place and after an insertion that makes it stale', () => {
		const features = [...base.features];
		const fits = [...base.fits];
		const index = indexRulebook(features, fits);
		const at = features.findIndex((f) => f.id === 'kf1003-bore');
		features[at] = { ...features[at], callout: 'Ø12 H7 Ⓔ' };
		const edited = check({ ...base, features, fits, index, only: { featureIds: ['kf1003-bore'] } });
		// With Ⓔ the bore is bounded: ENV-02 goes, and the journal now fails against 12.000 (envelope).
		expect(edited.map((r) => r.key)).toEqual(['FIT-02|fit:fit-journal|boundary']);
		features.unshift({ id: 'new-pin', kind: 'pin', internal: false, callout: 'Ø12 g6 Ⓔ' });
		fits.push({
			id: 'fit-new',
			holeFeatureId: 'kf1003-bore',
			shaftFeatureId: 'new-pin',
			intent: 'running'
		});
		check({ ...base, features, fits, index, only: { fitIds: ['fit-new'] } });
		check({ ...base, features, fits, index, only: { featureIds: ['kf1003-bore'] } });
	});
});
