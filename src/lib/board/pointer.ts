import type { BoardState } from './board.svelte';
import { pinchStep } from './gestures';
import type { Marker } from './markers';
import type { Point } from './view';

/**
 * Pointer input on the sheet: one pointer drags the sheet (or a movable marker under it), two
 * pinch, a press without movement selects the marker under it; hovering shows its tooltip.
 */
export class PointerInput {
	#pointers = new Map<number, Point>();
	#drag: { marker: Marker; grab: Point } | null = null;
	/** Where an area being dragged out in place mode started. */
	#area: Point | null = null;
	#travel = 0;

	constructor(
		readonly board: BoardState,
		readonly element: HTMLElement
	) {}

	#local(event: PointerEvent | WheelEvent): Point {
		const box = this.element.getBoundingClientRect();
		return { x: event.clientX - box.left, y: event.clientY - box.top };
	}

	down = (event: PointerEvent) => {
		if (event.button !== 0) return;
		this.element.setPointerCapture(event.pointerId);
		const at = this.#local(event);
		this.#pointers.set(event.pointerId, at);
		this.#travel = 0;
		if (this.#pointers.size === 1) {
			const marker = this.board.markerAt(at);
			if (marker?.movable) {
				const page = this.board.toPage(at);
				this.#drag = {
					marker,
					grab: { x: page.x - marker.location.x, y: page.y - marker.location.y }
				};
			} else if (!marker && this.board.placing && this.board.placesAreas) {
				this.#area = at;
			}
		} else {
			this.#drag = null;
			this.#area = null;
			this.board.sketch = null;
		}
	};

	move = (event: PointerEvent) => {
		const at = this.#local(event);
		const before = this.#pointers.get(event.pointerId);
		if (!before) {
			this.#hover(at);
			return;
		}
		if (this.#pointers.size === 2) {
			const [first, second] = [...this.#pointers.entries()];
			const other = first[0] === event.pointerId ? second[1] : first[1];
			const step = pinchStep([before, other], [at, other]);
			this.board.panBy(step.dx, step.dy);
			this.board.zoomBy(step.factor, step.anchor);
		} else if (this.#drag) {
			this.board.dragMarker(this.#drag.marker, at, this.#drag.grab);
		} else if (this.#area) {
			this.board.sketchArea(this.#area, at);
		} else {
			this.board.panBy(at.x - before.x, at.y - before.y);
		}
		this.#travel += Math.hypot(at.x - before.x, at.y - before.y);
		this.#pointers.set(event.pointerId, at);
	};

	up = (event: PointerEvent) => {
		if (!this.#pointers.delete(event.pointerId)) return;
		const at = this.#local(event);
		if (this.#drag && this.#travel > 2) this.board.dropMarker(this.#drag.marker.id);
		else if (this.#area && this.#travel > 4) this.board.placeArea(this.#area, at);
		else if (this.#travel <= 2 && this.#pointers.size === 0) {
			const marker = this.board.markerAt(at);
			if (!marker && this.board.placing) this.board.placeAt(at);
			else this.board.select(marker?.id ?? null);
		}
		this.#drag = null;
		this.#area = null;
		this.board.sketch = null;
	};

	leave = () => {
		if (this.#pointers.size === 0) this.board.hovered = null;
	};

	#hover(at: Point) {
		const marker = this.board.markerAt(at);
		const current = this.board.hovered;
		if (!marker) {
			if (current) this.board.hovered = null;
		} else if (current?.marker.id !== marker.id) {
			this.board.hovered = { marker, at: this.board.toScreen(marker.location) };
		}
		this.element.style.cursor = marker?.movable
			? 'move'
			: marker
				? 'pointer'
				: this.board.placing
					? 'crosshair'
					: '';
	}

	wheel = (event: WheelEvent, factor: number) => {
		this.board.zoomBy(factor, this.#local(event));
	};
}
