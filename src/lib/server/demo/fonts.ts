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
 * compressing did not make it smaller. Glyph records are padded to even lengths on the way
 * (see evenGlyphs).
 */
export function woffToSfnt(woff: Uint8Array): Uint8Array {
	const input = Buffer.from(woff.buffer, woff.byteOffset, woff.byteLength);
	if (input.readUInt32BE(0) !== 0x774f4646) throw new Error('not a WOFF 1.0 file');
	const flavor = input.readUInt32BE(4);
	const count = input.readUInt16BE(12);
	const tables = new Map<string, Buffer>();
	for (let i = 0; i < count; i++) {
		const at = 44 + i * 20;
		const offset = input.readUInt32BE(at + 4);
		const compressed = input.readUInt32BE(at + 8);
		const length = input.readUInt32BE(at + 12);
		const source = input.subarray(offset, offset + compressed);
		const data = compressed < length ? inflateSync(source) : source;
		if (data.length !== length) throw new Error('WOFF table length mismatch');
		tables.set(input.toString('latin1', at, at + 4), data);
	}
	evenGlyphs(tables);

	const headerSize = 12 + 16 * count;
	const size = [...tables.values()].reduce((sum, data) => sum + pad4(data.length), headerSize);
	const output = Buffer.alloc(size);
	writeOffsetTable(output, flavor, count);
	let offset = headerSize;
	[...tables].forEach(([tag, data], i) => {
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

/**
 * Pads every glyph record of a long-`loca` TrueType face to an even length. @pdf-lib/fontkit
 * 1.1.1 writes a small subset with a short `loca` (offsets halved) without padding, so after
 * one odd-length glyph every later glyph is cut short and draws nothing (Noto Sans Symbols 2
 * has 1351 such glyphs, ⌖ among them); fontkit fixed it upstream in 1.8.0, the fork never did.
 */
function evenGlyphs(tables: Map<string, Buffer>) {
	const [head, loca, glyf] = [tables.get('head'), tables.get('loca'), tables.get('glyf')];
	if (!head || !loca || !glyf || head.readInt16BE(50) !== 1) return;
	const glyphs = loca.length / 4 - 1;
	const offsets = Array.from({ length: glyphs + 1 }, (_, i) => loca.readUInt32BE(4 * i));
	const records = offsets.slice(0, -1).map((start, i) => glyf.subarray(start, offsets[i + 1]));
	const padded = records.map((r) => (r.length % 2 ? Buffer.concat([r, Buffer.alloc(1)]) : r));
	const newLoca = Buffer.alloc(loca.length);
	let end = 0;
	padded.forEach((record, i) => {
		end += record.length;
		newLoca.writeUInt32BE(end, 4 * (i + 1));
	});
	tables.set('loca', newLoca);
	tables.set('glyf', Buffer.concat(padded));
}

function checksum(data: Buffer) {
	const padded = Buffer.alloc(pad4(data.length));
	data.copy(padded);
	let sum = 0;
	for (let i = 0; i < padded.length; i += 4) sum = (sum + padded.readUInt32BE(i)) >>> 0;
	return sum;
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
		marks: woffToSfnt(
			fontsourceFile('noto-sans-symbols-2', 'noto-sans-symbols-2-symbols-400-normal.woff')
		)
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
