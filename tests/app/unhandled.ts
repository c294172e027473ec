// Set up for every app and browser test file: the app logs an unhandled promise rejection
// instead of stopping (src/hooks.server.ts); in the tests it fails the file during which it
// was logged, so no such bug hides behind a server that kept running.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, inject } from 'vitest';

const log = () => {
	try {
		return readFileSync(join(inject('dataDir'), 'app.log'), 'utf8');
	} catch {
		return '';
	}
};

let from = 0;
beforeAll(() => {
	from = log().length;
});
afterAll(() => {
	const found = /\[checkplate\] UNHANDLED REJECTION.*(\n.*){0,3}/.exec(log().slice(from));
	if (found) throw new Error(`The app had an unhandled promise rejection:\n${found[0]}`);
});
