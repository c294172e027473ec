import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { decodePDFRawStream, PDFDict, PDFDocument, PDFName, PDFRawStream } from 'pdf-lib';
import type { TextItem } from 'pdfjs-dist/types/src/display/api';
import {
	demoDrawingPdf,
	demoDrawings,
	type DemoDrawingNumber
} from '../../src/lib/server/demo/drawings';
import { parseCallout, type GeometricControl } from '../../src/lib/tolerance';
import { demoDrawings as rulebookDrawings } from '../unit/fixtures/demo-drawings';

const outDir = join(process.cwd(), 'test-results', 'demo');
const standardFontDataUrl =
	join(process.cwd(), 'node_modules', 'pdfjs-dist', 'standard_fonts') + '/';
const A3 = [1190.55, 841.89];
const A4 = [841.89, 595.28];

interface Extracted {
	pages: number;
	width: number;
	height: number;
	items: { str: string; x: number; y: number }[];
}

async function extract(bytes: Uint8Array): Promise<Extracted> {
	// pdf.js takes ownership of the buffer it is given: hand it a copy.
	const pdf = await getDocument({ data: bytes.slice(), standardFontDataUrl, verbosity: 0 }).promise;
	try {
		const page = await pdf.getPage(1);
		const viewport = page.getViewport({ scale: 1 });
		const content = await page.getTextContent();
		const items = (content.items as TextItem[])
			.filter((item) => 'str' in item)
			.map((item) => {
				const [x, y] = viewport.convertToViewportPoint(item.transform[4], item.transform[5]);
				return { str: item.str, x: x / viewport.width, y: y / viewport.height };
			});
		return { pages: pdf.numPages, width: viewport.width, height: viewport.height, items };
	} finally {
		await pdf.destroy();
	}
}

/**
 * Every embedded TrueType face, with its glyph index (`loca`) and glyph table (`glyf`) lengths:
 * the index must end exactly where the table does, or the last glyphs draw nothing.
 */
async function embeddedFaces(bytes: Uint8Array) {
	const doc = await PDFDocument.load(bytes);
	const faces: { name: string; indexEnd: number; tableLength: number }[] = [];
	for (const [, object] of doc.context.enumerateIndirectObjects()) {
		if (!(object instanceof PDFDict)) continue;
		const file = object.lookup(PDFName.of('FontFile2'));
		if (!(file instanceof PDFRawStream)) continue;
		const font = Buffer.from(decodePDFRawStream(file).decode());
		const tables = new Map<string, Buffer>();
		for (let i = 0; i < font.readUInt16BE(4); i++) {
			const at = 12 + 16 * i;
			const [offset, length] = [font.readUInt32BE(at + 8), font.readUInt32BE(at + 12)];
			tables.set(font.toString('latin1', at, at + 4), font.subarray(offset, offset + length));
		}
		const loca = tables.get('loca')!;
		const long = tables.get('head')!.readInt16BE(50) === 1;
		const indexEnd = long
			? loca.readUInt32BE(loca.length - 4)
			: 2 * loca.readUInt16BE(loca.length - 2);
		faces.push({
			name: String(object.get(PDFName.of('FontName'))),
			indexEnd,
			tableLength: tables.get('glyf')!.length
		});
	}
	return faces;
}

const normalise = (text: string) => text.replace(/\s+/g, ' ').trim();

const symbols: Partial<Record<GeometricControl['characteristic'], string>> = {
	straightness: '⏤',
	flatness: '⏥',
	perpendicularity: '⊥',
	position: '⌖',
	'circular-runout': '↗'
};
const modifiers = { mmc: ' Ⓜ', lmc: ' Ⓛ', rfs: '' };

/** A feature control frame as the drawing writes it, cell by cell. */
function frameText(c: GeometricControl): string {
	const symbol = symbols[c.characteristic];
	if (!symbol) throw new Error(`No symbol for ${c.characteristic} in this test`);
	const zone = `${c.diameterZone ? 'Ø' : ''}${c.value}${modifiers[c.modifier]}`;
	return [symbol, zone, ...c.datums].join(' ');
}

describe('demo drawings', () => {
	const generated = new Map<DemoDrawingNumber, { bytes: Uint8Array }>();

	beforeAll(async () => {
		mkdirSync(outDir, { recursive: true });
		for (const drawing of demoDrawings) {
			const bytes = await demoDrawingPdf(drawing.number);
			generated.set(drawing.number, { bytes });
			writeFileSync(join(outDir, `${drawing.number}.pdf`), bytes);
		}
	});

	it('describes the four drawings of the scenario', () => {
		expect(demoDrawings.map((d) => d.number)).toEqual(['KF-1001', 'KF-1002', 'KF-1003', 'KF-2001']);
		const units = Object.fromEntries(demoDrawings.map((d) => [d.number, [d.units, d.standard]]));
		expect(units['KF-1001']).toEqual(['mm', 'iso-8015']);
		expect(units['KF-2001']).toEqual(['in', 'asme-y14.5-2018']);
		for (const drawing of demoDrawings) {
			for (const callout of drawing.callouts) {
				expect(callout.x).toBeGreaterThan(0);
				expect(callout.x).toBeLessThan(1);
				expect(callout.y).toBeGreaterThan(0);
				expect(callout.y).toBeLessThan(1);
				expect(callout.sheet).toBe(1);
			}
		}
	});

	it('carries the deliberate callouts the rulebook is meant to find', () => {
		const texts = (number: DemoDrawingNumber) =>
			demoDrawings.find((d) => d.number === number)!.callouts.map((c) => c.text);
		expect(texts('KF-1001')).toEqual(
			expect.arrayContaining([
				'Ø18 H7',
				'2X Ø6 H7 Ⓔ',
				'⌖ Ø0.05 A B',
				'4X Ø6.6',
				'⌖ Ø0.2 Ⓜ A B',
				'(8)'
			])
		);
		expect(texts('KF-1002')).toEqual(
			expect.arrayContaining(['Ø12 g6', '⏤ Ø0.02 Ⓜ', 'Ø10 h6 Ⓔ', '3 N9', '90'])
		);
		expect(texts('KF-1003')).toEqual(expect.arrayContaining(['Ø12 H7', 'Ø18 p6 Ⓔ', '20']));
		expect(texts('KF-2001')).toEqual(
			expect.arrayContaining([
				'Ø.250-.2515',
				'Ø.2500-.249',
				'.250 ±.005',
				'⏥ .015',
				'PIVOT FIT: RUNNING'
			])
		);
	});

	it('writes every size callout so that the callout parser reads it', () => {
		for (const drawing of demoDrawings) {
			for (const callout of drawing.callouts.filter((c) => c.kind === 'size')) {
				const parsed = parseCallout(callout.text, { units: drawing.units });
				expect(parsed, `${drawing.number} ${callout.label}: ${callout.text}`).toMatchObject({
					ok: true
				});
			}
		}
	});

	it('draws what the rulebook fixture describes: features, frames, datums and notes', () => {
		expect(rulebookDrawings.map((d) => d.number)).toEqual(demoDrawings.map((d) => d.number));
		for (const drawing of demoDrawings) {
			const fixture = rulebookDrawings.find((d) => d.number === drawing.number)!;
			const where = drawing.number;
			expect(drawing.title, where).toBe(fixture.title);
			expect(drawing.units, where).toBe(fixture.drawing.units);
			expect(drawing.standard, where).toBe(fixture.drawing.standard);
			expect(drawing.generalTolerance, where).toEqual(fixture.drawing.generalTolerance);
			const drawn = (kind: string) =>
				drawing.callouts.filter((c) => c.kind === kind).map((c) => c.text);
			// Every feature of size is drawn with the fixture's callout and label, and nothing else.
			expect(
				drawing.callouts.filter((c) => c.kind === 'size').map((c) => [c.label, c.text]),
				where
			).toEqual(expect.arrayContaining(fixture.features.map((f) => [f.label, f.callout])));
			expect(drawn('size').length, where).toBe(fixture.features.length);
			expect(drawn('frame').sort(), where).toEqual(
				fixture.features.flatMap((f) => (f.controls ?? []).map(frameText)).sort()
			);
			const letters = new Set([
				...(fixture.drawing.datums ?? []),
				...fixture.features.flatMap((f) => (f.datumFeature ? [f.datumFeature] : []))
			]);
			expect(drawn('datum').sort(), where).toEqual([...letters].sort());
			expect(drawn('note'), where).toEqual(fixture.drawing.notes?.split('\n'));
		}
	});

	for (const drawing of demoDrawings) {
		describe(drawing.number, () => {
			// How long generation takes is measured nowhere here: timings belong in bench/.
			it('is a small PDF', () => {
				const { bytes } = generated.get(drawing.number)!;
				expect(new TextDecoder().decode(bytes.subarray(0, 5))).toBe('%PDF-');
				expect(bytes.length).toBeLessThan(200_000);
			});

			it('embeds four faces, each with every glyph whole', async () => {
				const faces = await embeddedFaces(generated.get(drawing.number)!.bytes);
				expect(faces).toHaveLength(4);
				for (const face of faces) expect(face.indexEnd, face.name).toBe(face.tableLength);
			});

			it('opens in pdf.js with one sheet of the stated size', async () => {
				const { pages, width, height } = await extract(generated.get(drawing.number)!.bytes);
				expect(pages).toBe(1);
				const expected = drawing.number === 'KF-1003' ? A4 : A3;
				expect(width).toBeCloseTo(expected[0], 0);
				expect(height).toBeCloseTo(expected[1], 0);
				expect(drawing.sheets).toEqual([
					{ width: expect.closeTo(expected[0], 0), height: expect.closeTo(expected[1], 0) }
				]);
			});

			it('has every callout as text, where the list says it is', async () => {
				const { items } = await extract(generated.get(drawing.number)!.bytes);
				const all = normalise(items.map((i) => i.str).join(' '));
				for (const callout of drawing.callouts) {
					expect(all, callout.text).toContain(normalise(callout.text));
					// The first piece of the callout sits near the recorded point.
					const near = items.filter((item) => {
						const piece = normalise(item.str);
						// pdf.js may join a note with its number into one item.
						return (
							piece.length > 0 &&
							(normalise(callout.text).startsWith(piece) ||
								piece.includes(normalise(callout.text))) &&
							Math.abs(item.x - callout.x) < 0.06 &&
							Math.abs(item.y - callout.y) < 0.03
						);
					});
					expect(near.length, `${callout.text} near (${callout.x}, ${callout.y})`).toBeGreaterThan(
						0
					);
				}
			});

			it('has its title block', async () => {
				const { items } = await extract(generated.get(drawing.number)!.bytes);
				const all = normalise(items.map((i) => i.str).join(' '));
				expect(all).toContain('KESTREL FLUIDICS');
				expect(all).toContain(drawing.number);
				expect(all).toContain(drawing.title.toUpperCase());
				expect(all).toContain(drawing.material);
				expect(all).toContain('1 OF 1');
				if (drawing.units === 'mm') {
					expect(all).toContain('ISO 8015');
					expect(all).toContain('ISO 2768-mK');
				} else {
					expect(all).toContain('ASME Y14.5-2018');
					expect(all).toContain('.XX ± .01');
					expect(all).toContain('.XXX ± .005');
				}
			});
		});
	}
});
