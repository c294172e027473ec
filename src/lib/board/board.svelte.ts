import type { PDFPageProxy } from 'pdfjs-dist';
import { browser } from '$app/environment';
import type { MarkerLayer } from './marker-layer';
import {
	areaBetween,
	markerAt,
	markerCentre,
	movedLocation,
	readingOrder,
	withMarkers,
	withoutMarkers,
	type Marker
} from './markers';
import { openFailure, openSheets, type SheetSource } from './pdf-document';
import { SheetPainter } from './sheet-painter';
import type { ViewLink } from './view-params';
import {
	centreOn,
	clampView,
	fitSheet,
	fitWidth,
	keepTopLeft,
	panBy,
	pageToScreen,
	sameView,
	screenToPage,
	zoomAround,
	type PageSize,
	type Point,
	type Size,
	type View
} from './view';

/** How long the view must stay still before the sharp picture is drawn. */
const settleMs = 140;
/** The zoom a marker is flown to when the view is further out than this. */
const flyZoom = 1.5;

export type BoardStatus = 'starting' | 'ready' | 'failed';

/** What the board tells its page: the view moved (to keep the URL), a marker moved or was picked. */
export interface BoardEvents {
	onview?: (link: ViewLink, how: 'replace' | 'push') => void;
	onmove?: (marker: Marker, location: Marker['location']) => void;
	onselect?: (marker: Marker | null) => void;
	/** In place mode, the sheet was clicked (or an item dropped on it) at `location`. */
	onplace?: (location: Marker['location'], item: string | null) => void;
}

/**
 * The board's state: which sheet, the view, the markers, and the two drawing surfaces (the sheet
 * and the marker layer), redrawn at most once per animation frame.
 */
export class BoardState {
	sheets = $state.raw<PageSize[]>([]);
	sheet = $state(1);
	view = $state.raw<View | null>(null);
	viewport = $state.raw<Size>({ width: 0, height: 0 });
	status = $state<BoardStatus>('starting');
	message = $state('');
	/** The current sheet's picture is drawn (until then a placeholder shows). */
	pictureReady = $state(false);
	markers = $state.raw<Marker[]>([]);
	selected = $state<string | null>(null);
	focused = $state<string | null>(null);
	hovered = $state.raw<{ marker: Marker; at: Point } | null>(null);
	highlighted = $state.raw<string[]>([]);
	/** Place mode: what a click on the sheet places (said on the sheet), or null. */
	placing = $state<string | null>(null);
	/** In place mode, a drag on the sheet marks an area (else it moves the sheet). */
	placesAreas = $state(false);
	/** The area being dragged out in place mode, in viewport pixels. */
	sketch = $state.raw<{ x: number; y: number; width: number; height: number } | null>(null);
	/** Nothing moving and no drawing under way: what is shown is final (for tests and the bench). */
	idle = $state(false);
	/** Figures for tests and the bench: milliseconds of the last picture and sharp drawings. */
	timings = $state({ firstSheet: 0, picture: 0, sharp: 0 });

	/** Milliseconds each recent frame took to draw (for the bench; not reactive). */
	readonly drawTimes: number[] = [];
	readonly events: BoardEvents;
	#source: SheetSource | null = null;
	#painter: SheetPainter | null = null;
	#layer: MarkerLayer | null = null;
	#page: PDFPageProxy | null = null;
	#frame = 0;
	#settle: ReturnType<typeof setTimeout> | undefined;
	#fitted: 'sheet' | 'width' | null = 'sheet';
	#pendingShow: string | null = null;
	/** The marker layer must be drawn afresh (not only moved with the view) on the next frame. */
	#markersChanged = true;
	#opened = performance.now();
	#opening: Promise<SheetSource> | null = null;

	constructor(sheets: PageSize[], url: string, events: BoardEvents = {}) {
		this.sheets = sheets;
		this.events = events;
		// In the browser the PDF starts opening at once, while the page is still being hydrated.
		if (browser) {
			this.#opening = openSheets(url);
			this.#opening.catch(() => {}); // reported by attach()
		}
	}

	get page(): PageSize {
		return this.sheets[this.sheet - 1] ?? { width: 1, height: 1 };
	}

	get zoomPercent() {
		return this.view ? Math.round(this.view.zoom * 100) : null;
	}

	/** Starts drawing into `canvas`, and the markers into `markerContainer` once Konva is loaded. */
	async attach(canvas: HTMLCanvasElement, markerContainer: HTMLDivElement) {
		const painter = new SheetPainter(canvas);
		painter.onpainted = (what, ms) => this.#painted(what, ms);
		painter.onfailed = (message) => this.#fail(message);
		this.#painter = painter;
		this.#requestFrame();
		let source: SheetSource;
		try {
			source = await this.#opening!;
		} catch (err) {
			this.#fail(openFailure(err));
			return;
		}
		if (this.#painter !== painter) return; // detached meanwhile: detach() closes it
		this.#source = source;
		await this.#showSheet(this.sheet);
		// Konva is loaded after the first sheet is drawn, so it does not compete with pdf.js.
		const { MarkerLayer } = await import('./marker-layer');
		if (this.#painter !== painter) return;
		this.#layer = new MarkerLayer(markerContainer, this.viewport);
		this.#layer.setMarkers(this.markers);
		this.#restyle();
		this.#scheduleSettle();
	}

	detach() {
		cancelAnimationFrame(this.#frame);
		clearTimeout(this.#settle);
		this.#painter?.destroy();
		this.#layer?.destroy();
		this.#painter = null;
		this.#layer = null;
		this.#source = null;
		this.#opening?.then((source) => source.close()).catch(() => {});
	}

	#fail(message: string) {
		this.status = 'failed';
		this.message = message;
	}

	#painted(what: 'picture' | 'sharp', ms: number) {
		if (what === 'picture') {
			this.timings.picture = ms;
			this.pictureReady = true;
			this.#draw();
			if (!this.timings.firstSheet) {
				this.timings.firstSheet = performance.now() - this.#opened;
				performance.mark('board:first-sheet');
			}
			this.#scheduleSettle();
		} else {
			const started = performance.now();
			this.#draw();
			this.timings.sharp = ms + performance.now() - started;
		}
	}

	async #showSheet(number: number) {
		const source = this.#source;
		const painter = this.#painter;
		if (!source || !painter) return;
		this.pictureReady = false;
		let page: PDFPageProxy;
		try {
			page = await source.page(number);
		} catch (err) {
			this.#fail(`Sheet ${number} could not be read: ${(err as Error).message}`);
			return;
		}
		if (number !== this.sheet) return;
		this.#page = page;
		const size = source.size(page);
		this.sheets = this.sheets.map((old, index) => (index === number - 1 ? size : old));
		painter.setPage(page, size);
		this.status = 'ready';
		if (!this.view || this.#fitted === 'sheet') this.view = fitSheet(size, this.viewport);
		this.#requestFrame();
		if (this.viewport.width > 0) await painter.paintPicture(this.viewport, devicePixelRatio);
	}

	/** The viewport's size changed (first layout, window, side panel). */
	resize(size: Size) {
		if (size.width === this.viewport.width && size.height === this.viewport.height) return;
		const first = this.viewport.width === 0;
		const before = this.viewport;
		this.viewport = size;
		this.#markersChanged = true;
		if (this.#fitted === 'sheet' || !this.view) this.view = fitSheet(this.page, size);
		else if (this.#fitted === 'width') this.view = fitWidth(this.page, size);
		else if (!first) this.view = keepTopLeft(this.view, this.page, before, size);
		if (first && this.#page) void this.#painter?.paintPicture(size, devicePixelRatio);
		this.#moved();
	}

	/** Shows the view of a link (on opening, and on back and forward). */
	applyLink(link: ViewLink) {
		const sheet = link.sheet ?? 1;
		const page = this.sheets[sheet - 1] ?? this.page;
		const fitted = fitSheet(page, this.viewport);
		this.#fitted = link.zoom === undefined ? 'sheet' : null;
		const view = clampView({
			zoom: link.zoom ?? fitted.zoom,
			centre: link.centre ?? fitted.centre
		});
		this.#pendingShow = link.show ?? null;
		this.#goToSheet(sheet, view);
		if (this.#pendingShow) this.#showPending();
	}

	/** The view as a link. */
	link(): ViewLink {
		const link: ViewLink = { sheet: this.sheet };
		if (this.view && this.#fitted !== 'sheet') {
			link.zoom = this.view.zoom;
			link.centre = this.view.centre;
		}
		if (this.selected) link.show = this.selected;
		return link;
	}

	#goToSheet(number: number, view: View | null) {
		const changed = number !== this.sheet;
		this.sheet = number;
		this.view = view;
		this.focused = null;
		this.hovered = null;
		if (changed || !this.#page) {
			this.#painter?.setPage(null, this.page);
			this.pictureReady = false;
			void this.#showSheet(number);
		}
		this.#moved();
	}

	setSheet(number: number) {
		if (number < 1 || number > this.sheets.length || number === this.sheet) return;
		this.#fitted = 'sheet';
		this.#goToSheet(number, fitSheet(this.sheets[number - 1], this.viewport));
		this.events.onview?.(this.link(), 'push');
	}

	setView(view: View, fitted: 'sheet' | 'width' | null = null) {
		const next = clampView(view);
		if (this.view && sameView(this.view, next)) return;
		this.#fitted = fitted;
		this.view = next;
		this.#moved();
	}

	zoomBy(factor: number, anchor?: Point) {
		if (!this.view) return;
		const at = anchor ?? { x: this.viewport.width / 2, y: this.viewport.height / 2 };
		this.setView(zoomAround(this.view, factor, at, this.page, this.viewport));
	}

	panBy(dx: number, dy: number) {
		if (this.view) this.setView(panBy(this.view, dx, dy, this.page));
	}

	fitSheet() {
		this.setView(fitSheet(this.page, this.viewport), 'sheet');
	}

	fitWidth() {
		this.setView(fitWidth(this.page, this.viewport), 'width');
	}

	/** Something moved: draw on the next frame, drop a sharp drawing under way, wait to settle. */
	#moved() {
		this.hovered = null;
		this.idle = false;
		this.#painter?.cancelSharp();
		this.#requestFrame();
		this.#scheduleSettle();
	}

	#scheduleSettle() {
		clearTimeout(this.#settle);
		this.#settle = setTimeout(async () => {
			if (!this.view || !this.#painter || this.viewport.width === 0) return;
			this.#markersChanged = true;
			this.#requestFrame();
			const view = this.view;
			await this.#painter.paintSharp(view, this.viewport, devicePixelRatio);
			// The URL follows once the sharp drawing is done, so its page update does not slow it.
			if (this.view === view) this.events.onview?.(this.link(), 'replace');
			// After the frame that draws it all afresh.
			await new Promise((done) => requestAnimationFrame(done));
			if (this.view === view && this.pictureReady && this.#layer) this.idle = true;
		}, settleMs);
	}

	#requestFrame() {
		if (this.#frame) return;
		this.#frame = requestAnimationFrame(() => {
			this.#frame = 0;
			this.#draw();
		});
	}

	#draw() {
		const view = this.view;
		if (!view || this.viewport.width === 0) return;
		const started = performance.now();
		this.#painter?.draw(view, this.viewport, devicePixelRatio);
		const frame = { sheet: this.sheet, view, page: this.page, viewport: this.viewport };
		if (this.#markersChanged || !this.#layer?.follow(frame)) this.#layer?.draw(frame);
		this.#markersChanged = false;
		this.drawTimes.push(performance.now() - started);
		if (this.drawTimes.length > 2000) this.drawTimes.splice(0, 1000);
	}

	// ---- Markers: the API the feature and finding pages draw with ----

	/** Puts these markers on the board, replacing any with the same id. */
	addMarkers(markers: Marker[]) {
		this.#setMarkers(withMarkers(this.markers, markers));
		if (this.#pendingShow) this.#showPending();
	}

	removeMarkers(ids: string[]) {
		this.#setMarkers(withoutMarkers(this.markers, ids));
	}

	/** Moves a marker (the page decides whether to keep it: `onmove` is called on drop). */
	moveMarker(id: string, location: Marker['location']) {
		this.#setMarkers(this.markers.map((m) => (m.id === id ? { ...m, location } : m)));
	}

	select(id: string | null) {
		this.selected = id;
		this.#restyle();
		this.events.onselect?.(this.markers.find((m) => m.id === id) ?? null);
	}

	highlight(ids: string[]) {
		this.highlighted = ids;
		this.#restyle();
	}

	/** Shows the marker: its sheet, centred, close enough to read; selects it. */
	flyTo(id: string, how: 'push' | 'replace' = 'push') {
		const marker = this.markers.find((m) => m.id === id);
		if (!marker) return false;
		const zoom = Math.max(this.view?.zoom ?? flyZoom, flyZoom);
		this.#fitted = null;
		this.selected = id;
		this.#restyle();
		this.#goToSheet(marker.location.sheet, centreOn(markerCentre(marker.location), zoom));
		this.events.onview?.(this.link(), how);
		this.events.onselect?.(marker);
		return true;
	}

	#showPending() {
		const id = this.#pendingShow;
		if (id && this.flyTo(id, 'replace')) this.#pendingShow = null;
	}

	#setMarkers(markers: Marker[]) {
		this.markers = markers;
		this.#layer?.setMarkers(markers);
		this.#restyle();
	}

	#restyle() {
		this.#markersChanged = true;
		this.#layer?.setLooks({
			selected: this.selected,
			focused: this.focused,
			highlighted: this.highlighted
		});
		this.#requestFrame();
	}

	/** The markers of this sheet in reading order, for keyboard focus. */
	sheetMarkers() {
		return readingOrder(this.markers.filter((m) => m.location.sheet === this.sheet));
	}

	/** Moves keyboard focus to the next (1) or previous (-1) marker, bringing it into view. */
	focusStep(step: 1 | -1 | 'first' | 'last') {
		const list = this.sheetMarkers();
		if (list.length === 0) return null;
		const index = list.findIndex((m) => m.id === this.focused);
		const next =
			step === 'first'
				? 0
				: step === 'last'
					? list.length - 1
					: index < 0
						? step === 1
							? 0
							: list.length - 1
						: (index + step + list.length) % list.length;
		const marker = list[next];
		this.focused = marker.id;
		this.#restyle();
		this.#bringIntoView(marker);
		return marker;
	}

	blurMarkers() {
		this.focused = null;
		this.#restyle();
	}

	#bringIntoView(marker: Marker) {
		if (!this.view) return;
		const at = this.toScreen(markerCentre(marker.location));
		const inside =
			at.x >= 0 && at.y >= 0 && at.x <= this.viewport.width && at.y <= this.viewport.height;
		if (!inside) {
			this.#fitted = null;
			this.setView(centreOn(markerCentre(marker.location), this.view.zoom));
		}
	}

	toScreen = (point: Point) =>
		this.view ? pageToScreen(point, this.view, this.page, this.viewport) : { x: 0, y: 0 };

	toPage = (point: Point) =>
		this.view ? screenToPage(point, this.view, this.page, this.viewport) : { x: 0, y: 0 };

	/** The marker under a screen point, if any. */
	markerAt(point: Point) {
		if (!this.view || !this.#layer) return null;
		const frame = { sheet: this.sheet, view: this.view, page: this.page, viewport: this.viewport };
		return markerAt(this.#layer.inView(frame), point, this.toScreen);
	}

	/** Drags a movable marker: `grab` is the pointer's offset from its location, in page units. */
	dragMarker(marker: Marker, pointer: Point, grab: Point) {
		const to = this.toPage(pointer);
		const location = movedLocation(marker.location, { x: to.x - grab.x, y: to.y - grab.y });
		this.moveMarker(marker.id, location);
		return location;
	}

	/** A point of the shown sheet under a screen point, as a marker location. */
	locationAt(point: Point): Marker['location'] {
		const at = this.toPage(point);
		const clamp = (v: number) => Math.min(1, Math.max(0, v));
		return { sheet: this.sheet, x: clamp(at.x), y: clamp(at.y) };
	}

	/** Place mode: a click (or Enter, at the view's centre) hands the location to the page. */
	placeAt(point: Point, item: string | null = null) {
		if (!this.view) return;
		this.events.onplace?.(this.locationAt(point), item);
	}

	/** Place mode: `words` say on the sheet what a click (or with `areas`, a drag) places. */
	startPlacing(words: string, areas = false) {
		this.placing = words;
		this.placesAreas = areas;
		this.sketch = null;
	}

	stopPlacing() {
		this.placing = null;
		this.placesAreas = false;
		this.sketch = null;
	}

	/** Place mode with areas: the area dragged out from `from` to `to` (viewport pixels). */
	sketchArea(from: Point, to: Point) {
		this.sketch = {
			x: Math.min(from.x, to.x),
			y: Math.min(from.y, to.y),
			width: Math.abs(to.x - from.x),
			height: Math.abs(to.y - from.y)
		};
	}

	/** The area dragged out is let go: the page gets it as an area location. */
	placeArea(from: Point, to: Point) {
		this.sketch = null;
		if (!this.view) return;
		this.events.onplace?.(areaBetween(this.sheet, this.toPage(from), this.toPage(to)), null);
	}

	dropMarker(id: string) {
		const marker = this.markers.find((m) => m.id === id);
		if (marker) this.events.onmove?.(marker, marker.location);
	}

	/** A small picture of a sheet for the sheet strip; the shown sheet's is copied, not redrawn. */
	async drawThumbnail(number: number, canvas: HTMLCanvasElement) {
		if (number === this.sheet && this.#painter?.thumbnail(canvas)) return true;
		const source = this.#source;
		if (!source) return false;
		try {
			const page = await source.page(number);
			const size = source.size(page);
			const viewport = page.getViewport({ scale: canvas.height / size.height });
			await page.render({ canvas, viewport, background: '#ffffff' }).promise;
			return true;
		} catch {
			return false;
		}
	}

	/** How many markers the last frame drew (for tests and the bench). */
	get markersDrawn() {
		return this.#layer?.drawn ?? 0;
	}
}
