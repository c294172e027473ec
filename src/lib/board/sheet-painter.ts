import type { PDFPageProxy, RenderTask } from 'pdfjs-dist';
import {
	pageRect,
	pictureResolution,
	regionRender,
	sameView,
	scaleOf,
	viewportPixelRatio,
	visibleBlit,
	type PageSize,
	type Size,
	type View
} from './view';

interface Region {
	canvas: HTMLCanvasElement;
	view: View;
	viewport: Size;
}

const paper = '#ffffff';
const surround = '#e9ecf0';

const cancelled = (err: unknown) =>
	(err as { name?: string })?.name === 'RenderingCancelledException';

/**
 * Draws one sheet into a viewport-sized canvas. A low-resolution picture of the whole sheet is
 * drawn once per sheet and shown transformed while the view moves; when the view settles, a
 * sharp picture of exactly the viewport is drawn by pdf.js (any older one still drawing is
 * cancelled) and shown over it. No canvas is ever larger than `canvasAreaLimit`.
 */
export class SheetPainter {
	#page: PDFPageProxy | null = null;
	#size: PageSize = { width: 1, height: 1 };
	#picture: { canvas: HTMLCanvasElement; resolution: number } | null = null;
	#pictureTask: RenderTask | null = null;
	#sharp: Region | null = null;
	#sharpTask: RenderTask | null = null;
	#spare: HTMLCanvasElement | null = null;
	#generation = 0;

	/** Called when something new can be shown; `timing` says what was drawn and how long it took. */
	onpainted: (what: 'picture' | 'sharp', milliseconds: number) => void = () => {};
	onfailed: (message: string) => void = () => {};

	constructor(readonly canvas: HTMLCanvasElement) {}

	get hasPicture() {
		return this.#picture !== null;
	}

	/** Shows another page: everything drawn for the last one is dropped, its renders stopped. */
	setPage(page: PDFPageProxy | null, size: PageSize) {
		this.#generation++;
		this.#pictureTask?.cancel();
		this.#sharpTask?.cancel();
		this.#page = page;
		this.#size = size;
		this.#picture = null;
		this.#sharp = null;
	}

	/** Draws the whole-sheet picture for this viewport, unless one sharp enough exists. */
	async paintPicture(viewport: Size, devicePixelRatio: number) {
		const page = this.#page;
		if (!page) return;
		const resolution = pictureResolution(this.#size, viewport, devicePixelRatio);
		if (this.#picture && this.#picture.resolution >= resolution * 0.9) return;
		const generation = this.#generation;
		this.#pictureTask?.cancel();
		const canvas = document.createElement('canvas');
		const pdfViewport = page.getViewport({ scale: resolution });
		canvas.width = Math.max(1, Math.floor(pdfViewport.width));
		canvas.height = Math.max(1, Math.floor(pdfViewport.height));
		const started = performance.now();
		const task = page.render({ canvas, viewport: pdfViewport, background: paper });
		this.#pictureTask = task;
		const done = await this.#finish(task, 'This sheet could not be drawn');
		if (this.#pictureTask === task) this.#pictureTask = null;
		if (!done || generation !== this.#generation) return;
		this.#picture = { canvas, resolution };
		this.onpainted('picture', performance.now() - started);
	}

	/** Waits for a drawing; false when it was cancelled or failed (a failure is reported). */
	async #finish(task: RenderTask, failure: string) {
		const generation = this.#generation;
		try {
			await task.promise;
			return true;
		} catch (err) {
			if (!cancelled(err) && generation === this.#generation) {
				this.onfailed(`${failure}: ${(err as Error).message}`);
			}
			return false;
		}
	}

	/** True when the whole-sheet picture already shows this view at full sharpness. */
	pictureIsSharp(view: View, devicePixelRatio: number) {
		const wanted = scaleOf(view.zoom) * devicePixelRatio;
		return this.#picture !== null && this.#picture.resolution >= wanted * 0.999;
	}

	/** The view settled: draw exactly the viewport sharp (cancelling an older such drawing). */
	async paintSharp(view: View, viewport: Size, devicePixelRatio: number) {
		const page = this.#page;
		this.#sharpTask?.cancel();
		if (!page || this.pictureIsSharp(view, devicePixelRatio)) {
			this.#sharp = null;
			return;
		}
		const generation = this.#generation;
		const started = performance.now();
		const ratio = viewportPixelRatio(viewport, devicePixelRatio);
		const region = regionRender(view, this.#size, viewport, ratio);
		// Two canvases take turns: the one on screen and the one being drawn.
		const canvas = this.#spare ?? document.createElement('canvas');
		this.#spare = null;
		canvas.width = region.width;
		canvas.height = region.height;
		const pdfViewport = page.getViewport({
			scale: region.scale,
			offsetX: region.offsetX,
			offsetY: region.offsetY
		});
		const task = page.render({ canvas, viewport: pdfViewport, background: paper });
		this.#sharpTask = task;
		const done = await this.#finish(task, 'The sharp view could not be drawn');
		if (this.#sharpTask === task) this.#sharpTask = null;
		if (!done || generation !== this.#generation) {
			this.#spare = canvas;
			return;
		}
		this.#spare = this.#sharp?.canvas ?? null;
		this.#sharp = { canvas, view, viewport: { ...viewport } };
		this.onpainted('sharp', performance.now() - started);
	}

	/** The view moves: a sharp drawing still under way is of no use any more. */
	cancelSharp() {
		this.#sharpTask?.cancel();
	}

	/** Composes the current view into the visible canvas: cheap, run on every frame that moved. */
	draw(view: View, viewport: Size, devicePixelRatio: number) {
		const ratio = viewportPixelRatio(viewport, devicePixelRatio);
		const width = Math.round(viewport.width * ratio);
		const height = Math.round(viewport.height * ratio);
		if (this.canvas.width !== width || this.canvas.height !== height) {
			this.canvas.width = width;
			this.canvas.height = height;
		}
		const context = this.canvas.getContext('2d', { alpha: false })!;
		context.setTransform(ratio, 0, 0, ratio, 0, 0);
		context.fillStyle = surround;
		context.fillRect(0, 0, viewport.width, viewport.height);
		const sharp = this.#sharp;
		const rect = pageRect(view, this.#size, viewport);
		if (
			sharp &&
			sameView(sharp.view, view) &&
			sharp.viewport.width === viewport.width &&
			sharp.viewport.height === viewport.height
		) {
			// The sharp drawing is exactly this view: copy it, nothing under it shows.
			context.save();
			context.beginPath();
			context.rect(rect.x, rect.y, rect.width, rect.height);
			context.clip();
			context.drawImage(sharp.canvas, 0, 0, viewport.width, viewport.height);
			context.restore();
			return;
		}
		const picture = this.#picture;
		if (!picture) {
			context.fillStyle = paper;
			context.fillRect(rect.x, rect.y, rect.width, rect.height);
			return;
		}
		// At its own scale the picture is copied pixel for pixel: snap it to whole device pixels.
		const exact = Math.abs(picture.resolution - scaleOf(view.zoom) * ratio) < 1e-6;
		const target = exact
			? {
					x: Math.round(rect.x * ratio) / ratio,
					y: Math.round(rect.y * ratio) / ratio,
					width: picture.canvas.width / ratio,
					height: picture.canvas.height / ratio
				}
			: rect;
		this.#blit(context, picture.canvas, target, viewport);
		if (sharp) {
			// pdf.js paints its background over the whole canvas: keep to the page.
			context.save();
			context.beginPath();
			context.rect(rect.x, rect.y, rect.width, rect.height);
			context.clip();
			const then = pageRect(sharp.view, this.#size, sharp.viewport);
			const k = rect.width / then.width;
			this.#blit(
				context,
				sharp.canvas,
				{
					x: rect.x - then.x * k,
					y: rect.y - then.y * k,
					width: sharp.viewport.width * k,
					height: sharp.viewport.height * k
				},
				viewport
			);
			context.restore();
		}
	}

	#blit(
		context: CanvasRenderingContext2D,
		source: HTMLCanvasElement,
		target: { x: number; y: number; width: number; height: number },
		viewport: Size
	) {
		const blit = visibleBlit(source, target, viewport);
		if (!blit) return;
		context.drawImage(
			source,
			blit.sx,
			blit.sy,
			blit.sw,
			blit.sh,
			blit.dx,
			blit.dy,
			blit.dw,
			blit.dh
		);
	}

	/** A small copy of the whole-sheet picture, for the sheet strip. */
	thumbnail(into: HTMLCanvasElement) {
		const picture = this.#picture;
		if (!picture) return false;
		const context = into.getContext('2d')!;
		context.drawImage(picture.canvas, 0, 0, into.width, into.height);
		return true;
	}

	destroy() {
		this.setPage(null, this.#size);
	}
}
