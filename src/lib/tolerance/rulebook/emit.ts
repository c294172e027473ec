import type { GoverningStandard } from '../drawing-context';
import { ruleExplanation, defaultSeverity } from './catalogue';
import type { ResultValue, RuleCode, RuleResult, RulebookTeam, Severity } from './types';

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

// Clauses, and severities that do not depend on the cause, read from the catalogue once per rule.
const clauses = new Map<string, string>();
const fixedSeverities = new Map<string, Severity | null>();

const OTHER_EDITION: Partial<Record<GoverningStandard, string>> = {
	'asme-y14.5-2018': 'ASME Y14.5-2009',
	'asme-y14.5-2009': 'ASME Y14.5-2018'
};

/**
 * The catalogue's clause for the edition the drawing states: on an ASME drawing the citations
 * of the other edition are left out (their numbering differs), so no number from the wrong
 * edition is shown. ISO and unstated drawings get every citation.
 */
export function citeFor(clause: string, standard: GoverningStandard): string {
	const other = OTHER_EDITION[standard];
	if (!other) return clause;
	const kept = clause.split('; ').filter((part) => !part.startsWith(other));
	return kept.length ? kept.join('; ') : clause;
}

function clauseOf(rule: RuleCode, standard: GoverningStandard): string {
	const key = `${rule}|${standard}`;
	let clause = clauses.get(key);
	if (clause === undefined)
		clauses.set(key, (clause = citeFor(ruleExplanation(rule)?.clause ?? '', standard)));
	return clause;
}

function severityOf(rule: RuleCode, cause: string): Severity {
	let fixed = fixedSeverities.get(rule);
	if (fixed === undefined) {
		const explanation = ruleExplanation(rule);
		fixed = explanation && !explanation.severities ? explanation.severity : null;
		fixedSeverities.set(rule, fixed);
	}
	return fixed ?? defaultSeverity(rule, cause);
}

export function toResult(
	finding: Finding,
	subject: Subject,
	team: RulebookTeam | undefined,
	standard: GoverningStandard
): RuleResult {
	return {
		key: resultKey(finding.rule, subject, finding.cause),
		rule: finding.rule,
		severity: team?.severityOverrides?.[finding.rule] ?? severityOf(finding.rule, finding.cause),
		subject: subject.subject,
		featureId: subject.featureId,
		fitId: subject.fitId,
		cause: finding.cause,
		message: finding.message,
		values: finding.values,
		line: finding.line,
		fix: finding.fix,
		clause: clauseOf(finding.rule, standard)
	};
}
