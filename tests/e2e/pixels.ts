import type { Page } from 'playwright-core';

type Rgb = [number, number, number];

/**
 * Pixel arithmetic on screenshots, done by the browser's own PNG decoder in `page` (any page):
 * the share of pixels that differ by more than `threshold` in some channel, and the mean
 * difference per channel.
 */
export async function comparePngs(page: Page, a: Buffer, b: Buffer, threshold = 48) {
	return page.evaluate(
		async ({ a, b, threshold }) => {
			const pixels = async (base64: string) => {
				const bytes = Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
				const bitmap = await createImageBitmap(new Blob([bytes], { type: 'image/png' }));
				const canvas = new OffscreenCanvas(bitmap.width, bitmap.height);
				const context = canvas.getContext('2d')!;
				context.drawImage(bitmap, 0, 0);
				return context.getImageData(0, 0, bitmap.width, bitmap.height);
			};
			const [first, second] = await Promise.all([pixels(a), pixels(b)]);
			if (first.width !== second.width || first.height !== second.height) {
				return { sameSize: false, differing: 1, meanDifference: 255 };
			}
			let differing = 0;
			let total = 0;
			for (let i = 0; i < first.data.length; i += 4) {
				let worst = 0;
				for (let c = 0; c < 3; c++) {
					const d = Math.abs(first.data[i + c] - second.data[i + c]);
					total += d;
					worst = Math.max(worst, d);
				}
				if (worst > threshold) differing++;
			}
			const count = first.data.length / 4;
			return { sameSize: true, differing: differing / count, meanDifference: total / (count * 3) };
		},
		{ a: a.toString('base64'), b: b.toString('base64'), threshold }
	);
}

/** The centre of the pixels of one colour (each channel within `tolerance`), or null. */
export async function colourCentre(page: Page, png: Buffer, colour: Rgb, tolerance = 40) {
	return page.evaluate(
		async ({ png, colour, tolerance }) => {
			const bytes = Uint8Array.from(atob(png), (c) => c.charCodeAt(0));
			const bitmap = await createImageBitmap(new Blob([bytes], { type: 'image/png' }));
			const canvas = new OffscreenCanvas(bitmap.width, bitmap.height);
			const context = canvas.getContext('2d')!;
			context.drawImage(bitmap, 0, 0);
			const { data, width } = context.getImageData(0, 0, bitmap.width, bitmap.height);
			let x = 0;
			let y = 0;
			let count = 0;
			for (let i = 0; i < data.length; i += 4) {
				if (
					Math.abs(data[i] - colour[0]) <= tolerance &&
					Math.abs(data[i + 1] - colour[1]) <= tolerance &&
					Math.abs(data[i + 2] - colour[2]) <= tolerance
				) {
					const p = i / 4;
					x += p % width;
					y += Math.floor(p / width);
					count++;
				}
			}
			return count === 0 ? null : { x: x / count + 0.5, y: y / count + 0.5, count };
		},
		{ png: png.toString('base64'), colour, tolerance }
	);
}
