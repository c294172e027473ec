import type { Point } from './view';

/** Zoom factor for a wheel turn: a mouse notch (100 px) zooms by about 1.2, a pinch faster. */
export function wheelFactor(deltaY: number, deltaMode: number, pinch: boolean) {
	const pixels = deltaMode === 1 ? deltaY * 16 : deltaMode === 2 ? deltaY * 400 : deltaY;
	const rate = pinch ? 0.01 : 0.0018;
	return Math.exp(-Math.max(-300, Math.min(300, pixels)) * rate);
}

/**
 * One step of a two-finger pinch: how much the fingers spread (the zoom factor), where between
 * them (the point held still) and how far that point moved (the pan).
 */
export function pinchStep(before: [Point, Point], after: [Point, Point]) {
	const spread = (pair: [Point, Point]) =>
		Math.max(1, Math.hypot(pair[1].x - pair[0].x, pair[1].y - pair[0].y));
	const middle = (pair: [Point, Point]) => ({
		x: (pair[0].x + pair[1].x) / 2,
		y: (pair[0].y + pair[1].y) / 2
	});
	const from = middle(before);
	const to = middle(after);
	return {
		factor: spread(after) / spread(before),
		anchor: to,
		dx: to.x - from.x,
		dy: to.y - from.y
	};
}

/** Keyboard steps on the sheet: what each key does. */
export type KeyAction =
	| { kind: 'zoom'; factor: number }
	| { kind: 'fit' }
	| { kind: 'pan'; dx: number; dy: number }
	| { kind: 'sheet'; step: 1 | -1 };

export const keyZoomFactor = 1.25;

/** The sheet's keys (+ − 0, arrows, PageUp, PageDown); `step` is the pan distance in pixels. */
export function keyAction(key: string, step: number): KeyAction | null {
	switch (key) {
		case '+':
		case '=':
			return { kind: 'zoom', factor: keyZoomFactor };
		case '-':
		case '_':
			return { kind: 'zoom', factor: 1 / keyZoomFactor };
		case '0':
			return { kind: 'fit' };
		case 'ArrowLeft':
			return { kind: 'pan', dx: step, dy: 0 };
		case 'ArrowRight':
			return { kind: 'pan', dx: -step, dy: 0 };
		case 'ArrowUp':
			return { kind: 'pan', dx: 0, dy: step };
		case 'ArrowDown':
			return { kind: 'pan', dx: 0, dy: -step };
		case 'PageUp':
			return { kind: 'sheet', step: -1 };
		case 'PageDown':
			return { kind: 'sheet', step: 1 };
		default:
			return null;
	}
}
