import type { MarkerLocation } from '$lib/schemas/location';
import type { Point } from './view';

export type { MarkerLocation };

/** How a marker is coloured: what it stands for, or a finding's severity. */
export type MarkerTone = 'feature' | 'finding' | 'critical' | 'major' | 'minor' | 'note';

export interface Marker {
	/** Unique on the board; also what `?show=` names (`feature-…`, `finding-…`). */
	id: string;
	location: MarkerLocation;
	/** The few characters drawn on it: a balloon number, `F-12`. */
	label: string;
	/** The hover and keyboard description. */
	title?: string;
	tone?: MarkerTone;
	/** An area marker's outline: a plain box, or a cloud as checkers draw around a region. */
	outline?: 'box' | 'cloud';
	/** May be moved by dragging it. */
	movable?: boolean;
	/** A round balloon (features) or a square-cornered tag (findings), told apart by shape. */
	shape?: MarkerShape;
	/**
	 * How far along it is, shown by its fill and not only by colour: solid (open), half
	 * (answered), hollow (closed), dashed (withdrawn).
	 */
	finish?: MarkerFinish;
}

export type MarkerShape = 'balloon' | 'tag';
export type MarkerFinish = 'solid' | 'half' | 'hollow' | 'dashed';

/** The drag-and-drop type of an item dragged from beside the board onto a sheet (its id). */
export const itemDragType = 'application/x-checkplate-item';

/** A point marker's radius in CSS pixels, at any zoom. */
export const markerRadius = 11;

export const isArea = (location: MarkerLocation) =>
	location.w !== undefined && location.h !== undefined;

/** The point a view flies to: a point marker itself, an area marker's middle. */
export function markerCentre(location: MarkerLocation): Point {
	return isArea(location)
		? { x: location.x + location.w! / 2, y: location.y + location.h! / 2 }
		: { x: location.x, y: location.y };
}

/** Where an area marker's label sits: its top-left corner. */
export const labelPoint = (location: MarkerLocation): Point => ({ x: location.x, y: location.y });

/**
 * The markers of `sheet` that touch the visible region (0..1 of the page), `margin` widened by
 * a constant screen distance in page units so a marker half out of view is still drawn.
 */
export function visibleMarkers(
	markers: Iterable<Marker>,
	sheet: number,
	region: { x0: number; y0: number; x1: number; y1: number },
	margin: Point
): Marker[] {
	const shown: Marker[] = [];
	for (const marker of markers) {
		const l = marker.location;
		if (l.sheet !== sheet) continue;
		const right = l.x + (l.w ?? 0);
		const bottom = l.y + (l.h ?? 0);
		if (
			right >= region.x0 - margin.x &&
			l.x <= region.x1 + margin.x &&
			bottom >= region.y0 - margin.y &&
			l.y <= region.y1 + margin.y
		) {
			shown.push(marker);
		}
	}
	return shown;
}

/**
 * The marker under a screen point, the one drawn last winning: a point marker within its
 * radius, an area marker on its outline (within `radius`) or on its label.
 */
export function markerAt(
	markers: Marker[],
	point: Point,
	toScreen: (location: Point) => Point,
	radius = markerRadius
): Marker | null {
	for (let i = markers.length - 1; i >= 0; i--) {
		const l = markers[i].location;
		const anchor = toScreen(labelPoint(l));
		if (Math.hypot(point.x - anchor.x, point.y - anchor.y) <= radius) return markers[i];
		if (!isArea(l)) continue;
		const corner = toScreen({ x: l.x + l.w!, y: l.y + l.h! });
		const inside =
			point.x >= anchor.x - radius &&
			point.x <= corner.x + radius &&
			point.y >= anchor.y - radius &&
			point.y <= corner.y + radius;
		const nearEdge =
			Math.min(
				Math.abs(point.x - anchor.x),
				Math.abs(point.x - corner.x),
				Math.abs(point.y - anchor.y),
				Math.abs(point.y - corner.y)
			) <=
			radius / 2;
		if (inside && nearEdge) return markers[i];
	}
	return null;
}

/** Reading order for keyboard focus: by sheet, then in bands from the top, then from the left. */
export function readingOrder(markers: Marker[], band = 0.02): Marker[] {
	return [...markers].sort((a, b) => {
		const la = a.location;
		const lb = b.location;
		if (la.sheet !== lb.sheet) return la.sheet - lb.sheet;
		const rowA = Math.floor(la.y / band);
		const rowB = Math.floor(lb.y / band);
		return rowA - rowB || la.x - lb.x || a.id.localeCompare(b.id);
	});
}

/** A moved marker's new location: the same size, kept on its sheet. */
export function movedLocation(location: MarkerLocation, to: Point): MarkerLocation {
	const w = location.w ?? 0;
	const h = location.h ?? 0;
	const x = Math.min(1 - w, Math.max(0, to.x));
	const y = Math.min(1 - h, Math.max(0, to.y));
	return { ...location, x, y };
}

/** The area between two points of a sheet (page units), corners in either order, kept on it. */
export function areaBetween(sheet: number, a: Point, b: Point): MarkerLocation {
	const clamp = (v: number) => Math.min(1, Math.max(0, v));
	const [x0, x1] = [clamp(Math.min(a.x, b.x)), clamp(Math.max(a.x, b.x))];
	const [y0, y1] = [clamp(Math.min(a.y, b.y)), clamp(Math.max(a.y, b.y))];
	return { sheet, x: x0, y: y0, w: x1 - x0, h: y1 - y0 };
}

/** `markers` with `added` put in, replacing those with the same id. */
export function withMarkers(markers: Marker[], added: Marker[]) {
	const ids = new Set(added.map((m) => m.id));
	return [...markers.filter((m) => !ids.has(m.id)), ...added];
}

export function withoutMarkers(markers: Marker[], ids: string[]) {
	const gone = new Set(ids);
	return markers.filter((m) => !gone.has(m.id));
}
