/*
 * The demo's review loop (PRODUCT.md §8): KF-1001 revision A goes round once — submitted,
 * returned with a message, its findings answered and resolved (demo/findings.ts), resubmitted,
 * approved by the checker and released — so supplier quality has a released revision with
 * resolved findings on first sign-in; KF-1002 stays in check. Invented for Checkplate.
 */
import type { RevisionState } from '$lib/revisions';
import type { DemoDrawingNumber } from './parts/definition';
import type { DemoPerson } from './findings';

export interface DemoMove {
	drawing: DemoDrawingNumber;
	by: DemoPerson;
	to: RevisionState;
	message: string;
}

/** Before the findings' threads: the submissions and the checker's return. */
export const demoMovesBefore: DemoMove[] = [
	{ drawing: 'KF-1001', by: 'drafter', to: 'in-check', message: 'First issue, ready for check.' },
	{
		drawing: 'KF-1001',
		by: 'checker',
		to: 'returned',
		message:
			'Returned: answer F-5 (is the bushing bore masked before anodising?) and F-6 (spot-face for the cover bolts), then resubmit.'
	},
	{ drawing: 'KF-1002', by: 'drafter', to: 'in-check', message: 'First issue, ready for check.' }
];

/** After the threads: resubmitted, approved and released. */
export const demoMovesAfter: DemoMove[] = [
	{
		drawing: 'KF-1001',
		by: 'drafter',
		to: 'in-check',
		message: 'Both findings answered: the bore is masked, the cover face is machined flat.'
	},
	{ drawing: 'KF-1001', by: 'checker', to: 'approved', message: 'Findings resolved.' },
	{
		drawing: 'KF-1001',
		by: 'checker',
		to: 'released',
		message: 'Released to the machine shops for the first batch.'
	}
];

/**
 * Before approving, the checker waives the rulebook's open critical and major findings on the
 * revision (the approval gate holds otherwise), each with this recorded reason: the demo's
 * mistakes stay visible on the released revision, as decisions rather than oversights.
 */
export const demoWaiverReason =
	'Accepted for the first batch of ten pumps only, by concession with the machine shop; to be corrected in revision B.';
