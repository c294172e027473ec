import Konva from 'konva';
import {
	isArea,
	labelPoint,
	markerRadius,
	visibleMarkers,
	type Marker,
	type MarkerFinish,
	type MarkerShape,
	type MarkerTone
} from './markers';
import { pageToScreen, scaleOf, visibleRegion, type PageSize, type Size, type View } from './view';

export const toneColours: Record<MarkerTone, string> = {
	feature: '#1d5fa8',
	finding: '#6a4c93',
	critical: '#b42318',
	major: '#b54708',
	minor: '#8a6d00',
	note: '#5f6b7a'
};

type Look = 'plain' | 'highlighted' | 'selected' | 'focused';

export interface Frame {
	sheet: number;
	view: View;
	page: PageSize;
	viewport: Size;
}

/**
 * The markers above the sheet: a Konva stage the size of the viewport with one shape that draws
 * only the markers in view, each from a small picture of itself drawn once (its "sprite") and
 * kept. Nothing here listens to pointer events: the board hit-tests in view coordinates.
 */
export class MarkerLayer {
	readonly stage: Konva.Stage;
	readonly #layer: Konva.Layer;
	#markers: Marker[] = [];
	#sprites = new Map<string, HTMLCanvasElement>();
	#frame: Frame | null = null;
	readonly #container: HTMLDivElement;
	#selected: string | null = null;
	#focused: string | null = null;
	#highlighted = new Set<string>();
	/** How many markers the last draw showed (for tests and the bench). */
	drawn = 0;

	constructor(container: HTMLDivElement, size: Size) {
		this.#container = container;
		container.style.transformOrigin = '0 0';
		this.stage = new Konva.Stage({ container, ...size, listening: false });
		this.#layer = new Konva.Layer({ listening: false });
		const shape = new Konva.Shape({
			listening: false,
			perfectDrawEnabled: false,
			sceneFunc: (context) => this.#paint(context._context)
		});
		this.#layer.add(shape);
		this.stage.add(this.#layer);
	}

	setMarkers(markers: Marker[]) {
		this.#markers = markers;
	}

	setLooks(looks: { selected: string | null; focused: string | null; highlighted: string[] }) {
		this.#selected = looks.selected;
		this.#focused = looks.focused;
		this.#highlighted = new Set(looks.highlighted);
	}

	/** Draws the markers for this frame now (once per animation frame at most). */
	draw(frame: Frame) {
		this.#frame = frame;
		this.#container.style.transform = '';
		if (this.stage.width() !== frame.viewport.width) this.stage.width(frame.viewport.width);
		if (this.stage.height() !== frame.viewport.height) this.stage.height(frame.viewport.height);
		this.#layer.draw();
	}

	/**
	 * While the view moves, the markers last drawn are moved and scaled with it as one picture
	 * (a CSS transform, nothing redrawn); false when that picture is too far off to stand in
	 * (another sheet or size, or zoomed more than twice in or out) and a draw is needed.
	 */
	follow(frame: Frame) {
		const drawn = this.#frame;
		if (
			!drawn ||
			drawn.sheet !== frame.sheet ||
			drawn.viewport.width !== frame.viewport.width ||
			drawn.viewport.height !== frame.viewport.height
		) {
			return false;
		}
		const k = frame.view.zoom / drawn.view.zoom;
		if (k < 0.5 || k > 2) return false;
		const scale = scaleOf(frame.view.zoom);
		const tx =
			(frame.viewport.width / 2) * (1 - k) +
			(drawn.view.centre.x - frame.view.centre.x) * frame.page.width * scale;
		const ty =
			(frame.viewport.height / 2) * (1 - k) +
			(drawn.view.centre.y - frame.view.centre.y) * frame.page.height * scale;
		this.#container.style.transform = `translate(${tx}px, ${ty}px) scale(${k})`;
		return true;
	}

	/** The markers this frame shows, in drawing order. */
	inView(frame: Frame): Marker[] {
		const region = visibleRegion(frame.view, frame.page, frame.viewport);
		const scale = scaleOf(frame.view.zoom);
		const margin = {
			x: (markerRadius * 4) / (frame.page.width * scale),
			y: (markerRadius * 2) / (frame.page.height * scale)
		};
		return visibleMarkers(this.#markers, frame.sheet, region, margin);
	}

	#look(id: string): Look {
		if (id === this.#selected) return 'selected';
		if (id === this.#focused) return 'focused';
		return this.#highlighted.has(id) ? 'highlighted' : 'plain';
	}

	#paint(context: CanvasRenderingContext2D) {
		const frame = this.#frame;
		if (!frame) return;
		const shown = this.inView(frame);
		const toScreen = (p: { x: number; y: number }) =>
			pageToScreen(p, frame.view, frame.page, frame.viewport);
		// Selected, focused and highlighted markers are drawn last, over the others.
		const order = (m: Marker) => (this.#look(m.id) === 'plain' ? 0 : 1);
		shown.sort((a, b) => order(a) - order(b));
		for (const marker of shown) {
			const look = this.#look(marker.id);
			const colour = toneColours[marker.tone ?? 'feature'];
			if (isArea(marker.location)) {
				const l = marker.location;
				const a = toScreen(l);
				const b = toScreen({ x: l.x + l.w!, y: l.y + l.h! });
				outline(context, a.x, a.y, b.x - a.x, b.y - a.y, marker.outline ?? 'box', colour, look);
			}
			const at = toScreen(labelPoint(marker.location));
			const sprite = this.#sprite(marker, look, colour);
			const size = sprite.width / spriteRatio();
			// Whole pixels: sharper, and about a third cheaper to draw than fractional ones.
			context.drawImage(
				sprite,
				Math.round(at.x - size / 2),
				Math.round(at.y - size / 2),
				size,
				size
			);
		}
		this.drawn = shown.length;
	}

	#sprite(marker: Marker, look: Look, colour: string) {
		const shape = marker.shape ?? 'balloon';
		const finish = marker.finish ?? 'solid';
		const key = `${colour}|${look}|${shape}|${finish}|${marker.label}`;
		let sprite = this.#sprites.get(key);
		if (!sprite) {
			sprite = drawSprite(marker.label, colour, look, shape, finish);
			this.#sprites.set(key, sprite);
		}
		return sprite;
	}

	destroy() {
		this.stage.destroy();
		this.#sprites.clear();
	}
}

const spriteRatio = () => Math.max(1, Math.ceil(globalThis.devicePixelRatio || 1));
/** Room around the disc for the selection and focus rings. */
const ringRoom = 6;

function drawSprite(
	label: string,
	colour: string,
	look: Look,
	shape: MarkerShape,
	finish: MarkerFinish
) {
	const ratio = spriteRatio();
	const size = shape === 'tag' ? tagSize : (markerRadius + ringRoom) * 2;
	const canvas = document.createElement('canvas');
	canvas.width = canvas.height = size * ratio;
	const c = canvas.getContext('2d')!;
	c.scale(ratio, ratio);
	const middle = size / 2;
	const path = shape === 'tag' ? tagPath : discPath;
	if (look !== 'plain') {
		path(c, middle, 4);
		c.lineWidth = look === 'highlighted' ? 4 : 2.5;
		c.strokeStyle = look === 'highlighted' ? 'rgba(255, 196, 0, 0.9)' : '#1f2933';
		if (look === 'focused') c.setLineDash([3, 2]);
		c.stroke();
		c.setLineDash([]);
	}
	const solid = finish === 'solid';
	path(c, middle, 0);
	c.fillStyle = solid ? colour : '#ffffff';
	c.fill();
	if (finish === 'half') {
		// Answered: a band filled at its left (its point, on a tag), the rest white.
		c.save();
		c.clip();
		c.fillStyle = colour;
		c.fillRect(0, 0, middle - (shape === 'tag' ? 10 : 4), size);
		c.restore();
	}
	path(c, middle, 0);
	c.lineWidth = solid ? 1.5 : 2;
	c.strokeStyle = solid ? '#ffffff' : colour;
	if (finish === 'dashed') c.setLineDash([3, 2]);
	c.stroke();
	c.setLineDash([]);
	if (label) {
		c.textAlign = 'center';
		c.textBaseline = 'middle';
		const fontSize = shape === 'tag' ? 10 : label.length > 3 ? 8 : 10;
		c.font = `600 ${fontSize}px 'Noto Sans', sans-serif`;
		const width = shape === 'tag' ? size - 2 * ringRoom - 10 : markerRadius * 2 - 3;
		// Beside an answered marker's band, its label moves right onto the white.
		const x = finish === 'half' ? middle + (shape === 'tag' ? 4 : 2) : middle;
		c.fillStyle = solid ? '#ffffff' : colour;
		c.fillText(label, x, middle + 0.5, width - (x - middle) * 2);
	}
	return canvas;
}

/** A round balloon, `grow` CSS pixels larger for the rings. */
function discPath(c: CanvasRenderingContext2D, middle: number, grow: number) {
	c.beginPath();
	c.arc(middle, middle, markerRadius + grow, 0, Math.PI * 2);
}

/** A tag's sprite: room for `F-123✓` and the rings. */
const tagSize = 52;

/** A tag: square-cornered, wider than high, with a point on its left (where it is pinned). */
function tagPath(c: CanvasRenderingContext2D, middle: number, grow: number) {
	const half = { w: middle - ringRoom + grow, h: markerRadius - 2 + grow };
	const point = 6;
	c.beginPath();
	c.moveTo(middle - half.w, middle);
	c.lineTo(middle - half.w + point, middle - half.h);
	c.lineTo(middle + half.w, middle - half.h);
	c.lineTo(middle + half.w, middle + half.h);
	c.lineTo(middle - half.w + point, middle + half.h);
	c.closePath();
}

function outline(
	c: CanvasRenderingContext2D,
	x: number,
	y: number,
	width: number,
	height: number,
	kind: 'box' | 'cloud',
	colour: string,
	look: Look
) {
	c.save();
	c.strokeStyle = colour;
	c.lineWidth = look === 'plain' ? 1.5 : 3;
	c.beginPath();
	if (kind === 'box') c.rect(x, y, width, height);
	else cloud(c, x, y, width, height);
	c.stroke();
	c.restore();
}

/** A cloud: scallops of about 14 CSS pixels along each edge, bulging outwards. */
function cloud(c: CanvasRenderingContext2D, x: number, y: number, width: number, height: number) {
	const edges: [number, number, number, number][] = [
		[x, y, x + width, y],
		[x + width, y, x + width, y + height],
		[x + width, y + height, x, y + height],
		[x, y + height, x, y]
	];
	for (const [x0, y0, x1, y1] of edges) {
		const length = Math.hypot(x1 - x0, y1 - y0);
		const count = Math.max(1, Math.min(200, Math.round(length / 14)));
		const angle = Math.atan2(y1 - y0, x1 - x0);
		const radius = length / count / 2;
		for (let i = 0; i < count; i++) {
			const cx = x0 + ((x1 - x0) * (i + 0.5)) / count;
			const cy = y0 + ((y1 - y0) * (i + 0.5)) / count;
			c.moveTo(cx - Math.cos(angle) * radius, cy - Math.sin(angle) * radius);
			c.arc(cx, cy, radius, angle + Math.PI, angle, false);
		}
	}
}
