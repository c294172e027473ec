#!/usr/bin/env node
// Lists which GD&T symbols each shipped font file lacks: the evidence behind the
// 'Checkplate Symbols' faces in src/app.css. Usage: node scripts/glyph-coverage.js
import { readFileSync } from 'node:fs';
import fontkit from '@pdf-lib/fontkit';

const glyphs = [...'⌀⏤⏥○⌭⌒⌓⊥∠∥⌖◎⌯↗⌰ⓂⓁⒺⒾⒻⓅⓈⓉⓊØ±×'];
const fonts = [
	'@fontsource/noto-sans/files/noto-sans-latin-400-normal.woff',
	'@fontsource/noto-sans-mono/files/noto-sans-mono-latin-400-normal.woff',
	'@fontsource/noto-sans-symbols/files/noto-sans-symbols-symbols-400-normal.woff',
	'@fontsource/noto-sans-symbols-2/files/noto-sans-symbols-2-symbols-400-normal.woff',
	'@fontsource/dejavu-sans/files/dejavu-sans-latin-400-normal.woff'
];
for (const file of fonts) {
	const font = fontkit.create(readFileSync(`node_modules/${file}`));
	const has = glyphs.filter((g) => font.hasGlyphForCodePoint(g.codePointAt(0)));
	console.log(`${file.split('/').pop()}\n  has:     ${has.join(' ')}`);
}
