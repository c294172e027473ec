import type { Role } from './db/schema';

/**
 * What each role may do in a team (PRODUCT.md §2). Roles are not ranks: every check names a
 * capability, never a role.
 */
export const capabilityTable = {
	/** See the team, its drawings and its released revisions. */
	view: ['admin', 'drafter', 'checker', 'quality'],
	/** See revisions in every state, not only released ones. */
	viewUnreleased: ['admin', 'drafter', 'checker'],
	/** Create drawings, upload revisions, submit for check. */
	author: ['admin', 'drafter'],
	/** Add and edit features and fits while the revision is not frozen. */
	editFeatures: ['admin', 'drafter', 'checker'],
	/** Raise findings and comment on anything. */
	raiseFindings: ['admin', 'drafter', 'checker'],
	/** Comment on released findings and features only. */
	commentReleased: ['admin', 'drafter', 'checker', 'quality'],
	/** Answer a finding assigned to you. */
	answerFindings: ['admin', 'drafter', 'checker'],
	/** Resolve, verify, withdraw, reopen findings; waive rule findings; run the rulebook. */
	judgeFindings: ['admin', 'checker'],
	/** Return, approve and release revisions. */
	decideRevisions: ['admin', 'checker'],
	/** Export CSV and PDF of revisions in every state. */
	exportUnreleased: ['admin', 'drafter', 'checker'],
	/** Export released revisions. */
	exportReleased: ['admin', 'drafter', 'checker', 'quality'],
	/** Members, invitations, roles and team settings. */
	manageTeam: ['admin']
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof capabilityTable;

export function can(role: Role, capability: Capability): boolean {
	return (capabilityTable[capability] as readonly Role[]).includes(role);
}

export { roleLabels } from '$lib/roles';
