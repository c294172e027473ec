/*
 * Rules judged on one feature, one file per family as the catalogue groups them: limits
 * (./rules-lim.ts), envelope (./rules-env.ts), geometric tolerances (./rules-geo.ts), notation
 * (./rules-doc.ts) and fit membership (FIT-06, ./rules-fit.ts). Fit membership comes in from
 * the caller so LIM-05, ENV-02/03 and FIT-06 give one result per feature however many fits it
 * takes part in.
 */
import { LengthFormat, value, type FeatureContext } from './context';
import type { Finding } from './emit';
import type { FeatureEnv } from './feature-env';
import { generalToleranceRule, notationRules } from './rules-doc';
import { envelopeRules, memberEnvelopeRules } from './rules-env';
import { memberLocationRule } from './rules-fit';
import { geometricRules } from './rules-geo';
import { limitRules } from './rules-lim';

export type { FeatureEnv, Membership } from './feature-env';

function zeroWidthMessage(message: string): boolean {
	return /equal|no tolerance/i.test(message);
}

/** LIM-01 / LIM-02 for a callout that cannot be read. */
function parseErrorRule(ctx: FeatureContext, out: Finding[]): void {
	const { feature } = ctx;
	const error = ctx.parseError!;
	const zero = zeroWidthMessage(error.message);
	out.push({
		rule: zero ? 'LIM-02' : 'LIM-01',
		cause: zero ? 'zero-width' : 'unreadable',
		message: zero
			? `The limits of ${feature.callout} leave no tolerance zone.`
			: `The callout ${feature.callout} cannot be read, so the feature has no limits.`,
		values: [
			value('callout', null, feature.callout),
			value('at character', null, String(error.position + 1))
		],
		line: `${error.message} (character ${error.position + 1})`,
		fix: zero
			? 'Give the size a zone of non-zero width.'
			: 'Correct the callout so it states the size and its tolerance.'
	});
}

export function featureRules(ctx: FeatureContext, env: FeatureEnv, out: Finding[]): void {
	if (ctx.parseError) return parseErrorRule(ctx, out);
	const { feature, spec, evaluation: e } = ctx;
	if (!spec || !e) return;
	const thread = spec.kind === 'thread' || feature.kind === 'thread';
	const f = new LengthFormat(ctx.drawing.units, e.places);
	if (!thread) {
		limitRules(ctx, env, out, f);
		generalToleranceRule(ctx, env, out, f);
	}
	envelopeRules(ctx, out, f);
	geometricRules(ctx, env, out, thread);
	notationRules(ctx, out);
	if (!thread && env.memberships.length) {
		memberEnvelopeRules(ctx, env, out, f);
		memberLocationRule(ctx, env, out);
	}
}
