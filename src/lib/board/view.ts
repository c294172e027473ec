/**
 * The board's view math: where a point of a sheet lands on the screen under zoom and pan, and
 * back. Pure and synchronous, so it is tested without a browser.
 *
 * Three spaces:
 * - PDF user space: points, y up, the page's own box before its /Rotate (pdf.js draws from it);
 * - the displayed page: the page as shown, after its rotation and within its crop box, `width`
 *   by `height` points; a marker's `location` is `x`, `y` in 0..1 of it from the top-left
 *   (PRODUCT.md §3);
 * - the screen: CSS pixels from the top-left of the sheet viewport.
 *
 * A view is a zoom (1 = 100 %: a point is 96/72 CSS pixels, the size on paper on a 96 dpi
 * screen) and the displayed page's point at the centre of the viewport, in 0..1.
 */

export interface PageSize {
	width: number;
	height: number;
}
export interface Size {
	width: number;
	height: number;
}
export interface Point {
	x: number;
	y: number;
}
export interface View {
	zoom: number;
	/** The displayed page's point at the viewport's centre, 0..1 from its top-left. */
	centre: Point;
}

/** CSS pixels per point at 100 %. */
export const pixelsPerPoint = 96 / 72;
export const minZoom = 0.02;
export const maxZoom = 8;
/** Room left around a sheet fitted into the viewport, in CSS pixels on each side. */
export const fitMargin = 12;

/**
 * The largest canvas drawn: 4096 × 4096 pixels. Chromium blanks a canvas past about 268 M
 * pixels or 32,767 pixels a side without an error; staying far below also keeps memory flat.
 */
export const canvasAreaLimit = 4096 * 4096;
export const canvasSideLimit = 8192;

/** CSS pixels per point of the displayed page at `zoom`. */
export const scaleOf = (zoom: number) => zoom * pixelsPerPoint;

export const clamp = (value: number, low: number, high: number) =>
	Math.min(high, Math.max(low, value));

export function clampView(view: View): View {
	return {
		zoom: clamp(view.zoom, minZoom, maxZoom),
		centre: { x: clamp(view.centre.x, 0, 1), y: clamp(view.centre.y, 0, 1) }
	};
}

/** A location (0..1 of the displayed page) on the screen. */
export function pageToScreen(point: Point, view: View, page: PageSize, viewport: Size): Point {
	const scale = scaleOf(view.zoom);
	return {
		x: (point.x - view.centre.x) * page.width * scale + viewport.width / 2,
		y: (point.y - view.centre.y) * page.height * scale + viewport.height / 2
	};
}

/** The screen point's place on the displayed page, 0..1 (outside the page beyond 0..1). */
export function screenToPage(point: Point, view: View, page: PageSize, viewport: Size): Point {
	const scale = scaleOf(view.zoom);
	return {
		x: view.centre.x + (point.x - viewport.width / 2) / (page.width * scale),
		y: view.centre.y + (point.y - viewport.height / 2) / (page.height * scale)
	};
}

/** Zoom by `factor`, keeping the page point under `anchor` (a screen point) where it is. */
export function zoomAround(
	view: View,
	factor: number,
	anchor: Point,
	page: PageSize,
	viewport: Size
): View {
	const zoom = clamp(view.zoom * factor, minZoom, maxZoom);
	const held = screenToPage(anchor, view, page, viewport);
	const scale = scaleOf(zoom);
	return clampView({
		zoom,
		centre: {
			x: held.x - (anchor.x - viewport.width / 2) / (page.width * scale),
			y: held.y - (anchor.y - viewport.height / 2) / (page.height * scale)
		}
	});
}

/** Move the sheet with the pointer by `dx`, `dy` CSS pixels. */
export function panBy(view: View, dx: number, dy: number, page: PageSize): View {
	const scale = scaleOf(view.zoom);
	return clampView({
		zoom: view.zoom,
		centre: {
			x: view.centre.x - dx / (page.width * scale),
			y: view.centre.y - dy / (page.height * scale)
		}
	});
}

/** The whole sheet in the viewport, centred. */
export function fitSheet(page: PageSize, viewport: Size): View {
	const width = Math.max(1, viewport.width - 2 * fitMargin);
	const height = Math.max(1, viewport.height - 2 * fitMargin);
	const zoom = Math.min(width / page.width, height / page.height) / pixelsPerPoint;
	return clampView({ zoom, centre: { x: 0.5, y: 0.5 } });
}

/** The sheet's width across the viewport, its top edge at the top. */
export function fitWidth(page: PageSize, viewport: Size): View {
	const zoom = Math.max(1, viewport.width - 2 * fitMargin) / page.width / pixelsPerPoint;
	const shown = viewport.height / (page.height * scaleOf(clamp(zoom, minZoom, maxZoom)));
	return clampView({ zoom, centre: { x: 0.5, y: Math.min(0.5, shown / 2) } });
}

/** Centre `point` at `zoom` (a marker flown to). */
export const centreOn = (point: Point, zoom: number): View => clampView({ zoom, centre: point });

/** The part of the displayed page in the viewport, 0..1, not clipped to the page. */
export function visibleRegion(view: View, page: PageSize, viewport: Size) {
	const topLeft = screenToPage({ x: 0, y: 0 }, view, page, viewport);
	const bottomRight = screenToPage({ x: viewport.width, y: viewport.height }, view, page, viewport);
	return { x0: topLeft.x, y0: topLeft.y, x1: bottomRight.x, y1: bottomRight.y };
}

/**
 * Device pixels per point for the whole-sheet picture: sharp at fit-sheet on this screen, never
 * past the canvas limits.
 */
export function pictureResolution(page: PageSize, viewport: Size, devicePixelRatio: number) {
	const wanted = scaleOf(fitSheet(page, viewport).zoom) * devicePixelRatio;
	const byArea = Math.sqrt(canvasAreaLimit / (page.width * page.height));
	const bySide = canvasSideLimit / Math.max(page.width, page.height);
	return Math.min(wanted, byArea, bySide);
}

/** The pixel ratio for a viewport-sized canvas: the screen's, lowered only past the limit. */
export function viewportPixelRatio(viewport: Size, devicePixelRatio: number) {
	const byArea = Math.sqrt(canvasAreaLimit / Math.max(1, viewport.width * viewport.height));
	const bySide = canvasSideLimit / Math.max(1, viewport.width, viewport.height);
	return Math.max(0.1, Math.min(devicePixelRatio, byArea, bySide));
}

/**
 * What to hand pdf.js to draw exactly the viewport at `view` into a canvas of `pixels`: the
 * scale (device pixels per point) and the offset of the page's top-left in device pixels.
 */
export function regionRender(view: View, page: PageSize, viewport: Size, pixelRatio: number) {
	const scale = scaleOf(view.zoom);
	const topLeft = pageToScreen({ x: 0, y: 0 }, view, page, viewport);
	return {
		scale: scale * pixelRatio,
		offsetX: topLeft.x * pixelRatio,
		offsetY: topLeft.y * pixelRatio,
		width: Math.round(viewport.width * pixelRatio),
		height: Math.round(viewport.height * pixelRatio)
	};
}

/**
 * A picture of `source` pixels that covers the screen rectangle `target` (CSS pixels), cut to
 * the viewport: the 9-argument drawImage's source and destination rectangles, or null when
 * nothing of it shows.
 */
export function visibleBlit(
	source: Size,
	target: { x: number; y: number; width: number; height: number },
	viewport: Size
) {
	const x0 = Math.max(0, target.x);
	const y0 = Math.max(0, target.y);
	const x1 = Math.min(viewport.width, target.x + target.width);
	const y1 = Math.min(viewport.height, target.y + target.height);
	if (x1 <= x0 || y1 <= y0 || target.width <= 0 || target.height <= 0) return null;
	const kx = source.width / target.width;
	const ky = source.height / target.height;
	return {
		sx: (x0 - target.x) * kx,
		sy: (y0 - target.y) * ky,
		sw: (x1 - x0) * kx,
		sh: (y1 - y0) * ky,
		dx: x0,
		dy: y0,
		dw: x1 - x0,
		dh: y1 - y0
	};
}

/** Where the page's top-left corner and its size land on the screen. */
export function pageRect(view: View, page: PageSize, viewport: Size) {
	const topLeft = pageToScreen({ x: 0, y: 0 }, view, page, viewport);
	const scale = scaleOf(view.zoom);
	return { x: topLeft.x, y: topLeft.y, width: page.width * scale, height: page.height * scale };
}

/**
 * A point of PDF user space on the displayed page, 0..1: `box` is the page's crop box
 * `[x0, y0, x1, y1]` (within its media box), `rotate` its /Rotate in degrees, clockwise.
 * Callouts read from the PDF's text arrive in user space; markers live on the displayed page.
 */
export function userSpaceToPage(point: Point, box: number[], rotate: number): Point {
	const [x0, y0, x1, y1] = box;
	const width = x1 - x0;
	const height = y1 - y0;
	const u = (point.x - x0) / width; // 0..1 rightwards on the unrotated page
	const v = (y1 - point.y) / height; // 0..1 downwards on the unrotated page
	switch (((rotate % 360) + 360) % 360) {
		case 90:
			return { x: 1 - v, y: u };
		case 180:
			return { x: 1 - u, y: 1 - v };
		case 270:
			return { x: v, y: 1 - u };
		default:
			return { x: u, y: v };
	}
}

/** The displayed page's size in points for a crop box and rotation. */
export function displayedSize(box: number[], rotate: number): PageSize {
	const width = Math.abs(box[2] - box[0]);
	const height = Math.abs(box[3] - box[1]);
	return ((rotate % 180) + 180) % 180 === 90 ? { width: height, height: width } : { width, height };
}

export const sameView = (a: View, b: View) =>
	Math.abs(a.zoom - b.zoom) < 1e-9 &&
	Math.abs(a.centre.x - b.centre.x) < 1e-9 &&
	Math.abs(a.centre.y - b.centre.y) < 1e-9;

/**
 * The view after the viewport changed size from `before` to `after` on its right and bottom
 * edges (a side panel widening, say): what shows at the top-left stays where it is on screen.
 */
export function keepTopLeft(view: View, page: PageSize, before: Size, after: Size): View {
	const scale = scaleOf(view.zoom);
	return clampView({
		zoom: view.zoom,
		centre: {
			x: view.centre.x + (after.width - before.width) / 2 / (page.width * scale),
			y: view.centre.y + (after.height - before.height) / 2 / (page.height * scale)
		}
	});
}
