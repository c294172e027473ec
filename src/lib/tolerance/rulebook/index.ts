export { evaluate, scopeOf, indexRulebook } from './evaluate';
export type { Scope, RulebookIndex } from './evaluate';
export { CATALOGUE, ADVISORY, FAMILIES, ruleExplanation, defaultSeverity } from './catalogue';
export type { RuleExplanation } from './catalogue';
export { resultKey } from './emit';
export { sizeFindings } from './single';
export type { LoneSize, SizeFinding } from './single';
export { RULE_CODES } from './types';
export type {
	FeatureKind,
	ResultValue,
	RuleCode,
	RuleResult,
	RulebookDrawing,
	RulebookFastener,
	RulebookFeature,
	RulebookFit,
	RulebookInput,
	RulebookTeam,
	Severity
} from './types';
