// Callout parser throughput: 100,000 generated callouts, against JSON.parse of the same
// strings as a yardstick. Run: npx tsx bench/parser.ts
import { parseCallout } from '../src/lib/tolerance/callout';

const COUNT = 100_000;
const ROUNDS = 5;

let seed = 0x2f6e2b1;
function random(n: number): number {
	seed = (seed * 1_103_515_245 + 12_345) & 0x7fffffff;
	return seed % n;
}

function pick<T>(items: readonly T[]): T {
	return items[random(items.length)];
}

function mm(places: number): string {
	const whole = 1 + random(500);
	if (places === 0) return String(whole);
	return `${whole}.${String(random(10 ** places)).padStart(places, '0')}`;
}

function inch(places: number): string {
	return `.${String(random(10 ** places)).padStart(places, '0')}`;
}

const holes = ['H7', 'H8', 'G7', 'JS9', 'K6', 'N7', 'P7', 'F8', 'H11'];
const shafts = ['g6', 'h6', 'f7', 'k6', 'js6', 'p6', 's6', 'e9', 'h11'];

function callout(): { text: string; units: 'mm' | 'in' } {
	const quantity = random(4) === 0 ? `${2 + random(6)}X ` : '';
	switch (random(14)) {
		case 0:
			return { text: `${quantity}${mm(3)}-${mm(3)}`, units: 'mm' };
		case 1:
			return { text: `${quantity}Ø${mm(0)} ${pick(holes)}`, units: 'mm' };
		case 2:
			return { text: `Ø${mm(0)} ${pick(holes)}/${pick(shafts)}`, units: 'mm' };
		case 3:
			return { text: `${quantity}Ø${mm(2)} ±0.${random(90) + 10}`, units: 'mm' };
		case 4:
			return { text: `Ø${mm(0)} ${pick(shafts)} (${mm(3)}/${mm(3)})`, units: 'mm' };
		case 5:
			return { text: `${mm(1)} +0.0${random(90) + 10}/0 Ⓔ`, units: 'mm' };
		case 6:
			return { text: `${quantity}${inch(3)} ±${inch(3)}`, units: 'in' };
		case 7:
			return { text: `${inch(4)}/${inch(4)}`, units: 'in' };
		case 8:
			return {
				text: `${quantity}M${pick(['3', '4', '5', '6', '8', '10'])}x${pick(['0.5', '0.7', '1', '1.25'])}-6H THRU`,
				units: 'mm'
			};
		case 9:
			return { text: `1/4-20 UNC-2B ↧.50`, units: 'in' };
		case 10:
			return { text: `[Ø${mm(2)}]`, units: 'mm' };
		case 11:
			return { text: `R${mm(1)} MAX`, units: 'mm' };
		case 12:
			return { text: `${quantity}Ø${mm(1)} ${pick(holes)} ↧${mm(0)}`, units: 'mm' };
		default:
			return { text: `${mm(2).replace('.', ',')} ±0,${random(90) + 10}`, units: 'mm' };
	}
}

const inputs = Array.from({ length: COUNT }, callout);
const texts = inputs.map((c) => c.text);
const json = texts.map((t) => JSON.stringify({ callout: t }));

let sink = 0;
function timeParser(): number {
	const start = performance.now();
	for (let i = 0; i < COUNT; i++) {
		const r = parseCallout(inputs[i].text, { units: inputs[i].units });
		if (r.ok) sink++;
	}
	return performance.now() - start;
}

function timeJson(): number {
	const start = performance.now();
	for (let i = 0; i < COUNT; i++) {
		const r = JSON.parse(json[i]) as { callout: string };
		sink += r.callout.length & 1;
	}
	return performance.now() - start;
}

// Warm up, then keep the best round of each so both figures are steady-state.
timeParser();
timeJson();
let parser = Infinity;
let yardstick = Infinity;
for (let round = 0; round < ROUNDS; round++) {
	parser = Math.min(parser, timeParser());
	yardstick = Math.min(yardstick, timeJson());
}

const failures = inputs.filter((c) => !parseCallout(c.text, { units: c.units }).ok);
const perCallout = (parser * 1000) / COUNT;
const perJson = (yardstick * 1000) / COUNT;
console.log(`callouts parsed: ${COUNT} (${failures.length} rejected)`);
console.log(`parseCallout:  ${perCallout.toFixed(3)} µs per callout`);
console.log(`JSON.parse:    ${perJson.toFixed(3)} µs per string`);
console.log(`ratio:         ${(perCallout / perJson).toFixed(2)} × JSON.parse`);
if (failures.length > 0) console.log('first rejected:', failures[0].text);
if (sink < 0) console.log(sink);
