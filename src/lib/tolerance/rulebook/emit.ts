import { ruleExplanation, defaultSeverity } from './catalogue';
import type { ResultValue, RuleCode, RuleResult, RulebookTeam } from './types';

export interface Finding {
	rule: RuleCode;
	cause: string;
	message: string;
	values: ResultValue[];
	line: string;
	fix: string;
}

export type Subject =
	| { subject: 'drawing'; featureId: null; fitId: null }
	| { subject: 'feature'; featureId: string; fitId: string | null }
	| { subject: 'fit'; featureId: string | null; fitId: string };

export function resultKey(rule: RuleCode, subject: Subject, cause: string): string {
	const id =
		subject.subject === 'drawing'
			? 'drawing'
			: subject.subject === 'feature'
				? `feature:${subject.featureId}`
				: `fit:${subject.fitId}`;
	return `${rule}|${id}|${cause}`;
}

export function toResult(
	finding: Finding,
	subject: Subject,
	team: RulebookTeam | undefined
): RuleResult {
	return {
		key: resultKey(finding.rule, subject, finding.cause),
		rule: finding.rule,
		severity:
			team?.severityOverrides?.[finding.rule] ?? defaultSeverity(finding.rule, finding.cause),
		subject: subject.subject,
		featureId: subject.featureId,
		fitId: subject.fitId,
		cause: finding.cause,
		message: finding.message,
		values: finding.values,
		line: finding.line,
		fix: finding.fix,
		clause: ruleExplanation(finding.rule)?.clause ?? ''
	};
}
