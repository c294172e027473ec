import { describe, expect, it } from 'vitest';
import { areaBetween, markerAt } from '../../src/lib/board/markers';
import {
	editRefused,
	findingIdOf,
	findingMarker,
	movesAllowed,
	type FindingPowers
} from '../../src/lib/findings';

const finding = {
	id: '00000000-0000-4000-8000-000000000001',
	number: 12,
	severity: 'critical' as const,
	state: 'raised' as const,
	text: 'The bore has no surface finish.',
	location: { sheet: 2, x: 0.2, y: 0.3, w: 0.1, h: 0.05 }
};

describe('finding markers', () => {
	it('are tags, not balloons, coloured by severity and filled by state', () => {
		const marker = findingMarker(finding, true);
		expect(marker).toMatchObject({
			id: `finding-${finding.id}`,
			label: 'F-12',
			shape: 'tag',
			tone: 'critical',
			finish: 'solid',
			outline: 'cloud',
			movable: true
		});
		expect(marker.title).toBe('F-12 · Critical · Raised: The bore has no surface finish.');
		const finish = (state: 'answered' | 'resolved' | 'verified' | 'withdrawn') =>
			findingMarker({ ...finding, state }, false);
		expect(finish('answered').finish).toBe('half');
		expect(finish('resolved').finish).toBe('hollow');
		expect(finish('verified')).toMatchObject({ finish: 'hollow', label: 'F-12✓' });
		expect(finish('withdrawn').finish).toBe('dashed');
		// A point finding has no outline.
		const point = findingMarker({ ...finding, location: { sheet: 1, x: 0.5, y: 0.5 } }, false);
		expect(point.outline).toBeUndefined();
		expect(findingIdOf(marker.id)).toBe(finding.id);
		expect(findingIdOf('feature-1')).toBeNull();
	});

	it('an area dragged out either way is the same area, kept on the sheet', () => {
		const area = areaBetween(1, { x: 0.6, y: 0.5 }, { x: 0.2, y: 0.1 });
		expect(area.sheet).toBe(1);
		expect(area.x).toBeCloseTo(0.2);
		expect(area.y).toBeCloseTo(0.1);
		expect(area.w).toBeCloseTo(0.4);
		expect(area.h).toBeCloseTo(0.4);
		const clamped = areaBetween(3, { x: -0.2, y: 0.9 }, { x: 0.3, y: 1.4 });
		expect(clamped).toMatchObject({ sheet: 3, x: 0, y: 0.9, w: 0.3 });
		expect(clamped.h).toBeCloseTo(0.1);
		// Picked on its tag (its top-left corner) like any area marker.
		const marker = findingMarker({ ...finding, location: area }, false);
		const toScreen = (p: { x: number; y: number }) => ({ x: p.x * 1000, y: p.y * 1000 });
		expect(markerAt([marker], { x: 203, y: 98 }, toScreen)?.id).toBe(marker.id);
	});
});

describe('what a person may do to a finding', () => {
	const powers = (role: FindingPowers['role'], userId = 'me'): FindingPowers => ({
		userId,
		role,
		raise: role !== 'quality',
		answer: role !== 'quality',
		judge: role === 'admin' || role === 'checker'
	});
	const raised = { state: 'raised' as const, number: 3, assigneeId: null, raisedBy: 'checker' };

	it('answering is for whoever may answer (the assignee when there is one); the rest for judges', () => {
		expect(movesAllowed(powers('drafter'), raised)).toEqual(['answered']);
		expect(movesAllowed(powers('checker'), raised)).toEqual(['answered', 'withdrawn']);
		expect(movesAllowed(powers('quality'), raised)).toEqual([]);
		expect(movesAllowed(powers('drafter'), { ...raised, assigneeId: 'someone else' })).toEqual([]);
		expect(movesAllowed(powers('checker'), { ...raised, state: 'answered' })).toEqual([
			'resolved',
			'withdrawn',
			'raised'
		]);
		expect(movesAllowed(powers('drafter'), { ...raised, state: 'resolved' })).toEqual([]);
	});

	it('its place (and fields) are edited by whoever raised it or a judge', () => {
		expect(editRefused(powers('checker', 'anyone'), raised)).toBeNull();
		expect(editRefused(powers('drafter', 'checker'), raised)).toBeNull();
		expect(editRefused(powers('drafter'), raised)).toBe(
			'Only whoever raised F-3 or a checker edits it'
		);
		expect(editRefused(powers('quality'), raised)).toBe(
			'Your role (Supplier quality) does not edit findings'
		);
	});
});
