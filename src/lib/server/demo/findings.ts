/*
 * The demo's manual findings (PRODUCT.md §8): what the demo checker raised on revision A of
 * the Kestrel drawings, and the short threads with the drafter. Invented for Checkplate; the
 * rulebook's own findings come from its run, not from here.
 */
import type { FindingState } from '$lib/findings';
import type { Severity } from '$lib/tolerance/rulebook';
import type { DemoDrawingNumber } from './parts/definition';
import type { CalloutKind } from './sheet';

/** Who does a step: the demo's checker or drafter. */
export type DemoPerson = 'checker' | 'drafter';

export type DemoStep =
	{ by: DemoPerson; comment: string } | { by: DemoPerson; to: FindingState; message: string };

export interface DemoFinding {
	drawing: DemoDrawingNumber;
	severity: Severity;
	text: string;
	/** The rulebook fixture's feature id (review.ts) the finding is about. */
	feature?: string;
	/** The drawn callout it points at; with `area`, an area of that size from near its start. */
	at: { kind: CalloutKind; text: string; area?: { w: number; h: number } };
	assignDrafter: boolean;
	steps: DemoStep[];
}

export const demoFindings: DemoFinding[] = [
	{
		drawing: 'KF-1001',
		severity: 'minor',
		text: 'Anodising: say whether the bushing bore is masked. A clear anodic layer grows into the bore and changes the press fit of the bushing.',
		at: { kind: 'note', text: 'ANODISE CLEAR AFTER MACHINING', area: { w: 0.3, h: 0.035 } },
		assignDrafter: true,
		steps: [
			{
				by: 'checker',
				comment:
					'@tomas the bore limits are for the machined size. Is the bore masked before anodising, or should the limits be after coating?'
			},
			{
				by: 'drafter',
				comment:
					'The bore is masked before anodising, so its limits stay the machined size. The shop plugs it as usual.'
			},
			{ by: 'drafter', to: 'answered', message: 'Bore masked: the limits are machined sizes.' },
			{ by: 'checker', to: 'resolved', message: 'Masking confirmed; the limits stand.' }
		]
	},
	{
		drawing: 'KF-1001',
		severity: 'note',
		text: 'Cover bolt holes: state a spot-face for the M6 heads, or confirm that the cover face is flat enough as machined.',
		feature: 'kf1001-bolt',
		at: { kind: 'size', text: '4X Ø6.6' },
		assignDrafter: true,
		steps: [
			{
				by: 'drafter',
				comment: 'The cover face is machined flat in the same set-up, so no spot-face is needed.'
			},
			{ by: 'drafter', to: 'answered', message: 'No spot-face: the face is machined.' },
			{ by: 'checker', to: 'resolved', message: 'Agreed, the machined face is enough.' }
		]
	},
	{
		drawing: 'KF-1002',
		severity: 'major',
		text: 'Keyway: the width has a tolerance but the depth is not given. Add the keyway depth with its limits in the section.',
		feature: 'kf1002-keyway',
		at: { kind: 'size', text: '3 N9' },
		assignDrafter: true,
		steps: [
			{
				by: 'checker',
				comment:
					'@tomas in the section only the width is dimensioned; the shop needs:\n\n- the depth from the shaft surface\n- its limits'
			},
			{
				by: 'drafter',
				comment:
					'Right, the depth went missing when I moved the section. I will add it in revision B.'
			},
			{ by: 'drafter', to: 'answered', message: 'Depth to be added in revision B.' }
		]
	},
	{
		drawing: 'KF-2001',
		severity: 'note',
		text: 'Base thickness .25 takes the title-block tolerance for two places. Is that what the bracket needs?',
		feature: 'kf2001-base',
		at: { kind: 'size', text: '.25' },
		assignDrafter: true,
		steps: [
			{
				by: 'drafter',
				comment: 'Yes: the base carries no fit, and the title-block tolerance is plenty.'
			},
			{ by: 'checker', to: 'withdrawn', message: 'The title-block tolerance is enough here.' }
		]
	}
];
