#!/usr/bin/env node
// `npm test`: unit and integration tests (on PGlite, then on a PostgreSQL server), then the built
// app over HTTP (one instance on PGlite, two on one PostgreSQL server) and in Chromium.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { findChromium } from '../tests/e2e/chromium.js';
import { findPostgresBin, startPostgres } from './postgres.js';

// The pinned AWS SDK's notice about Node 22 would repeat in every test process.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
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

function loud(lines) {
	const bar = '!'.repeat(78);
	console.log(`\n${bar}\n${lines.map((line) => `!! ${line}`).join('\n')}\n${bar}\n`);
}

let failed = run([...vitest('core'), '--project', 'unit', '--project', 'integration']) !== 0;

// The integration suite again, on a real PostgreSQL server started for it.
if (!findPostgresBin()) {
	loud([
		"TESTS ON POSTGRESQL SKIPPED (the integration suite's second run and the two-instance",
		'app tests): no PostgreSQL found at /usr/lib/postgresql/*/bin/initdb. Install it with:',
		'    sudo apt-get install -y postgresql',
		'and run npm test again.'
	]);
} else {
	console.log('\nThe integration suite on a PostgreSQL server:');
	const server = await startPostgres().catch((err) => {
		console.error(err);
		return null;
	});
	if (!server) failed = true;
	else {
		// Ctrl-C must not leave a server running in the background.
		process.once('SIGINT', () => {
			server.stop();
			process.exit(130);
		});
		try {
			const env = { TEST_DATABASE: 'postgres', TEST_POSTGRES_URL: server.url };
			failed = run([...vitest('postgres'), '--project', 'integration'], env) !== 0 || failed;
		} finally {
			server.stop();
		}
	}
}

// The app and browser tests drive the built app; SKIP_BUILD=1 reuses the last build.
const buildDir = process.env.BUILD_DIR || 'build';
if (process.env.SKIP_BUILD !== '1' || !existsSync(`${buildDir}/handler.js`)) {
	failed = run(['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'error']) !== 0 || failed;
}
failed = run([...vitest('app'), '--project', 'app']) !== 0 || failed;

const chromium = findChromium();
if (!chromium) {
	loud([
		'BROWSER TESTS SKIPPED: no Chromium found (looked at $CHROMIUM_PATH,',
		'/usr/bin/chromium, /usr/bin/chromium-browser). Install it with:',
		'    sudo apt-get install -y chromium',
		'and run npm test again.'
	]);
} else {
	failed =
		run([...vitest('browser'), '--project', 'e2e'], { CHROMIUM_PATH: chromium }) !== 0 || failed;
}

const totals = { passed: 0, failed: 0, skipped: 0 };
for (const name of ['core', 'postgres', 'app', 'browser']) {
	const file = `${results}/${name}.json`;
	if (!existsSync(file)) continue;
	const report = JSON.parse(readFileSync(file, 'utf8'));
	totals.passed += report.numPassedTests;
	totals.failed += report.numFailedTests;
	totals.skipped += report.numPendingTests + report.numTodoTests;
}
console.log(`\nTotal: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
process.exit(failed ? 1 : 0);
