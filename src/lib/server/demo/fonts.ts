import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import fontkit from '@pdf-lib/fontkit';
import type { PDFDocument } from 'pdf-lib';

type Fontkit = Parameters<PDFDocument['registerFontkit']>[0];
type Font = ReturnType<Fontkit['create']>;

/** The faces the demo drawings are set in, as sfnt (TrueType) bytes ready for pdf-lib. */
export interface DrawingFontFiles {
	text: Uint8Array;
	bold: Uint8Array;
	symbols: Uint8Array;
	marks: Uint8Array;
}

/**
 * fontkit reads WOFF, but inflates a whole table on every glyph it decodes, which makes
 * laying out text with a large face take hundreds of milliseconds; plain sfnt bytes do not.
 * WOFF 1.0: a 44-byte header, 20-byte table entries, each table zlib-compressed unless
 * compressing did not make it smaller.
 */
export function woffToSfnt(woff: Uint8Array): Uint8Array {
	const input = Buffer.from(woff.buffer, woff.byteOffset, woff.byteLength);
	if (input.readUInt32BE(0) !== 0x774f4646) throw new Error('not a WOFF 1.0 file');
	const flavor = input.readUInt32BE(4);
	const count = input.readUInt16BE(12);
	const tables = Array.from({ length: count }, (_, i) => {
		const at = 44 + i * 20;
		return {
			tag: input.readUInt32BE(at),
			offset: input.readUInt32BE(at + 4),
			compressed: input.readUInt32BE(at + 8),
			length: input.readUInt32BE(at + 12),
			checksum: input.readUInt32BE(at + 16)
		};
	});
	const headerSize = 12 + 16 * count;
	const size = tables.reduce((sum, t) => sum + pad4(t.length), headerSize);
	const output = Buffer.alloc(size);
	writeOffsetTable(output, flavor, count);
	let offset = headerSize;
	tables.forEach((table, i) => {
		const source = input.subarray(table.offset, table.offset + table.compressed);
		const data = table.compressed < table.length ? inflateSync(source) : source;
		if (data.length !== table.length) throw new Error('WOFF table length mismatch');
		const entry = 12 + i * 16;
		output.writeUInt32BE(table.tag, entry);
		output.writeUInt32BE(table.checksum, entry + 4);
		output.writeUInt32BE(offset, entry + 8);
		output.writeUInt32BE(table.length, entry + 12);
		data.copy(output, offset);
		offset += pad4(table.length);
	});
	return new Uint8Array(output.buffer, output.byteOffset, output.byteLength);
}

function pad4(n: number) {
	return (n + 3) & ~3;
}

function writeOffsetTable(output: Buffer, flavor: number, count: number) {
	let selector = 0;
	while (2 << selector <= count) selector++;
	const range = (1 << selector) * 16;
	output.writeUInt32BE(flavor, 0);
	output.writeUInt16BE(count, 4);
	output.writeUInt16BE(range, 6);
	output.writeUInt16BE(selector, 8);
	output.writeUInt16BE(count * 16 - range, 10);
}

function checksum(data: Buffer) {
	let sum = 0;
	const padded = Buffer.alloc(pad4(data.length));
	data.copy(padded);
	for (let i = 0; i < padded.length; i += 4) sum = (sum + padded.readUInt32BE(i)) >>> 0;
	return sum;
}

/** An sfnt font file from named tables (tables sorted by tag, as the format asks). */
function buildSfnt(tables: Record<string, Buffer>): Uint8Array {
	const tags = Object.keys(tables).sort();
	const headerSize = 12 + 16 * tags.length;
	const size = tags.reduce((sum, tag) => sum + pad4(tables[tag].length), headerSize);
	const output = Buffer.alloc(size);
	writeOffsetTable(output, 0x00010000, tags.length);
	let offset = headerSize;
	tags.forEach((tag, i) => {
		const data = tables[tag];
		const entry = 12 + i * 16;
		output.write(tag, entry, 'latin1');
		output.writeUInt32BE(checksum(data), entry + 4);
		output.writeUInt32BE(offset, entry + 8);
		output.writeUInt32BE(data.length, entry + 12);
		data.copy(output, offset);
		offset += pad4(data.length);
	});
	return new Uint8Array(output.buffer, output.byteOffset, output.byteLength);
}

type Contour = [x: number, y: number, onCurve: boolean][];

function rectangle(x0: number, y0: number, x1: number, y1: number): Contour {
	// Clockwise (outer) in TrueType's y-up space.
	return [
		[x0, y0, true],
		[x0, y1, true],
		[x1, y1, true],
		[x1, y0, true]
	];
}

/** A circle as eight off-curve points; the implied on-curve midpoints lie on radius r. */
function circle(cx: number, cy: number, r: number, clockwise: boolean): Contour {
	const reach = r / Math.cos(Math.PI / 8);
	return Array.from({ length: 8 }, (_, i) => {
		const angle = ((clockwise ? -i : i) * Math.PI) / 4 + Math.PI / 8;
		return [
			Math.round(cx + reach * Math.cos(angle)),
			Math.round(cy + reach * Math.sin(angle)),
			false
		];
	});
}

function simpleGlyph(contours: Contour[]): Buffer {
	const points = contours.flat();
	const xs = points.map((p) => p[0]);
	const ys = points.map((p) => p[1]);
	const size = 10 + 2 * contours.length + 2 + points.length * 5;
	const glyph = Buffer.alloc(pad4(size));
	glyph.writeInt16BE(contours.length, 0);
	glyph.writeInt16BE(Math.min(...xs), 2);
	glyph.writeInt16BE(Math.min(...ys), 4);
	glyph.writeInt16BE(Math.max(...xs), 6);
	glyph.writeInt16BE(Math.max(...ys), 8);
	let at = 10;
	let end = -1;
	for (const contour of contours) {
		end += contour.length;
		glyph.writeUInt16BE(end, at);
		at += 2;
	}
	glyph.writeUInt16BE(0, at); // no hinting instructions
	at += 2;
	for (const p of points) glyph.writeUInt8(p[2] ? 1 : 0, at++);
	let previous = 0;
	for (const x of xs) {
		glyph.writeInt16BE(x - previous, at);
		previous = x;
		at += 2;
	}
	previous = 0;
	for (const y of ys) {
		glyph.writeInt16BE(y - previous, at);
		previous = y;
		at += 2;
	}
	return glyph;
}

/**
 * None of the faces shipped as runtime dependencies has the position symbol ⌖ (U+2316), so
 * the drawings carry a one-glyph face of our own: a ring with a cross reaching past it, in
 * the stroke weight of Noto Sans Symbols. With it the symbol is real text in the PDF.
 */
export function buildMarksFont(): Uint8Array {
	const unitsPerEm = 1000;
	const advance = 1000;
	const [cx, cy, r, stroke, reach] = [500, 330, 290, 70, 450];
	const position = simpleGlyph([
		circle(cx, cy, r, true),
		circle(cx, cy, r - stroke, false),
		rectangle(cx - reach, cy - stroke / 2, cx + reach, cy + stroke / 2),
		rectangle(cx - stroke / 2, cy - reach, cx + stroke / 2, cy + reach)
	]);
	const glyphs = [Buffer.alloc(0), position];
	const bbox = [cx - reach, cy - reach, cx + reach, cy + reach];
	const maxPoints = 8 + 8 + 4 + 4;

	const head = Buffer.alloc(54);
	head.writeUInt32BE(0x00010000, 0);
	head.writeUInt32BE(0x00010000, 4);
	head.writeUInt32BE(0x5f0f3cf5, 12);
	head.writeUInt16BE(0x000b, 16);
	head.writeUInt16BE(unitsPerEm, 18);
	bbox.forEach((v, i) => head.writeInt16BE(v, 36 + 2 * i));
	head.writeUInt16BE(8, 46);
	head.writeInt16BE(2, 48);
	head.writeInt16BE(1, 50); // long loca offsets

	const hhea = Buffer.alloc(36);
	hhea.writeUInt32BE(0x00010000, 0);
	hhea.writeInt16BE(800, 4);
	hhea.writeInt16BE(-200, 6);
	hhea.writeUInt16BE(advance, 10);
	hhea.writeInt16BE(bbox[0], 12);
	hhea.writeInt16BE(advance - bbox[2], 14);
	hhea.writeInt16BE(bbox[2], 16);
	hhea.writeInt16BE(1, 18);
	hhea.writeUInt16BE(glyphs.length, 34);

	const maxp = Buffer.alloc(32);
	maxp.writeUInt32BE(0x00010000, 0);
	maxp.writeUInt16BE(glyphs.length, 4);
	maxp.writeUInt16BE(maxPoints, 6);
	maxp.writeUInt16BE(4, 8);
	maxp.writeUInt16BE(2, 14);

	const hmtx = Buffer.alloc(4 * glyphs.length);
	hmtx.writeUInt16BE(500, 0);
	hmtx.writeUInt16BE(advance, 4);
	hmtx.writeInt16BE(bbox[0], 6);

	const loca = Buffer.alloc(4 * (glyphs.length + 1));
	let offset = 0;
	glyphs.forEach((g, i) => {
		loca.writeUInt32BE(offset, 4 * i);
		offset += g.length;
	});
	loca.writeUInt32BE(offset, 4 * glyphs.length);

	// cmap: one Windows Unicode BMP subtable, format 4, mapping U+2316 to glyph 1.
	const segments = [
		[0x2316, 0x2316, 1 - 0x2316],
		[0xffff, 0xffff, 1]
	];
	const subtable = Buffer.alloc(16 + segments.length * 8);
	const segX2 = segments.length * 2;
	subtable.writeUInt16BE(4, 0);
	subtable.writeUInt16BE(subtable.length, 2);
	subtable.writeUInt16BE(segX2, 6);
	subtable.writeUInt16BE(2, 8);
	subtable.writeUInt16BE(0, 10);
	subtable.writeUInt16BE(segX2 - 2, 12);
	segments.forEach(([start, end, delta], i) => {
		subtable.writeUInt16BE(end, 14 + 2 * i);
		subtable.writeUInt16BE(start, 16 + segX2 + 2 * i);
		subtable.writeUInt16BE(delta & 0xffff, 16 + 2 * segX2 + 2 * i);
	});
	const cmap = Buffer.concat([Buffer.from([0, 0, 0, 1, 0, 3, 0, 1, 0, 0, 0, 12]), subtable]);

	const post = Buffer.alloc(32);
	post.writeUInt32BE(0x00030000, 0);
	post.writeInt16BE(-100, 8);
	post.writeInt16BE(50, 10);

	const names: [number, string][] = [
		[1, 'Checkplate Marks'],
		[2, 'Regular'],
		[4, 'Checkplate Marks'],
		[6, 'CheckplateMarks']
	];
	const strings = names.map(([, s]) => Buffer.from(s, 'utf16le').swap16());
	const name = Buffer.alloc(6 + 12 * names.length);
	name.writeUInt16BE(names.length, 2);
	name.writeUInt16BE(name.length, 4);
	let stringOffset = 0;
	names.forEach(([id], i) => {
		const at = 6 + 12 * i;
		name.writeUInt16BE(3, at);
		name.writeUInt16BE(1, at + 2);
		name.writeUInt16BE(0x409, at + 4);
		name.writeUInt16BE(id, at + 6);
		name.writeUInt16BE(strings[i].length, at + 8);
		name.writeUInt16BE(stringOffset, at + 10);
		stringOffset += strings[i].length;
	});

	return buildSfnt({
		cmap,
		glyf: Buffer.concat(glyphs),
		head,
		hhea,
		hmtx,
		loca,
		maxp,
		name: Buffer.concat([name, ...strings]),
		post
	});
}

function fontsourceFile(pkg: string, file: string) {
	return readFileSync(join(process.cwd(), 'node_modules', '@fontsource', pkg, 'files', file));
}

let files: DrawingFontFiles | undefined;
const parsed = new Map<Uint8Array, Font>();

/** The drawing faces, read once per process from the installed @fontsource packages. */
export function drawingFontFiles(): DrawingFontFiles {
	files ??= {
		text: woffToSfnt(fontsourceFile('dejavu-sans', 'dejavu-sans-latin-400-normal.woff')),
		bold: woffToSfnt(fontsourceFile('dejavu-sans', 'dejavu-sans-latin-700-normal.woff')),
		symbols: woffToSfnt(
			fontsourceFile('noto-sans-symbols', 'noto-sans-symbols-symbols-400-normal.woff')
		),
		marks: buildMarksFont()
	};
	return files;
}

/**
 * A fontkit stand-in for `PDFDocument.registerFontkit` that parses each face once per
 * process: parsing and the first layout of a large face are the slow part of a drawing.
 */
export const cachedFontkit: Fontkit = {
	create(data: Uint8Array, postscriptName?: string): Font {
		let font = parsed.get(data);
		if (!font) {
			font = fontkit.create(data, postscriptName);
			parsed.set(data, font);
		}
		return font;
	}
};

export function parsedFont(data: Uint8Array): Font {
	return cachedFontkit.create(data);
}
