#!/usr/bin/env node
// `npm test`: unit and integration tests, then the built app over HTTP and in Chromium.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { findChromium } from '../tests/e2e/chromium.js';

process.chdir(resolve(import.meta.dirname, '..'));
const results = 'test-results/vitest';
rmSync(results, { recursive: true, force: true });
const vitest = (name) => [
	'node_modules/vitest/vitest.mjs',
	'run',
	'--reporter=default',
	'--reporter=json',
	`--outputFile.json=${results}/${name}.json`
];

function run(args, env = {}) {
	const result = spawnSync(process.execPath, args, {
		stdio: 'inherit',
		env: { ...process.env, ...env }
	});
	return result.status ?? 1;
}

let failed = run([...vitest('core'), '--project', 'unit', '--project', 'integration']) !== 0;

// The app and browser tests drive the built app; SKIP_BUILD=1 reuses the last build.
if (process.env.SKIP_BUILD !== '1' || !existsSync('build/handler.js')) {
	failed = run(['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'error']) !== 0 || failed;
}
failed = run([...vitest('app'), '--project', 'app']) !== 0 || failed;

const chromium = findChromium();
if (!chromium) {
	const bar = '!'.repeat(78);
	console.log(`\n${bar}\n!! BROWSER TESTS SKIPPED: no Chromium found (looked at $CHROMIUM_PATH,`);
	console.log('!! /usr/bin/chromium, /usr/bin/chromium-browser). Install it with:');
	console.log('!!     sudo apt-get install -y chromium');
	console.log(`!! and run npm test again.\n${bar}\n`);
} else {
	failed =
		run([...vitest('browser'), '--project', 'e2e'], { CHROMIUM_PATH: chromium }) !== 0 || failed;
}

const totals = { passed: 0, failed: 0, skipped: 0 };
for (const name of ['core', 'app', 'browser']) {
	const file = `${results}/${name}.json`;
	if (!existsSync(file)) continue;
	const report = JSON.parse(readFileSync(file, 'utf8'));
	totals.passed += report.numPassedTests;
	totals.failed += report.numFailedTests;
	totals.skipped += report.numPendingTests + report.numTodoTests;
}
console.log(`\nTotal: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
process.exit(failed ? 1 : 0);
