#!/usr/bin/env node
// `npm start`: build when needed, start the local stand-ins for services that are not
// configured, then the app; print one URL; Ctrl-C stops everything.
import { spawn, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { isLoopbackHost } from '../src/lib/server/loopback.js';
import { readLockHolder } from './lock.js';

const root = resolve(import.meta.dirname, '..');
process.chdir(root);
if (existsSync('.env')) process.loadEnvFile('.env');

const env = { ...process.env };
// The AWS SDK is pinned to the last releases that support Node 20 (see DEVELOPERS.md); its
// notice about later releases says nothing the operator can act on at each start.
env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
const dataDir = resolve(env.DATA_DIR || './data');
const port = Number(env.PORT || 3000);
// The mail stand-in shows every message it caught (sign-in and reset links among them) at
// /dev/mail: with it, listen on this machine alone unless HOST says otherwise.
const mailStandIn = !env.SMTP_URL;
const host = env.HOST || (mailStandIn ? '127.0.0.1' : '0.0.0.0');
const say = (line) => console.log(`[checkplate] ${line}`);

function fail(message) {
	console.error(`[checkplate] ${message}`);
	process.exit(1);
}

// The app takes the real lock; refusing here first avoids starting stand-ins for nothing.
if (!env.DATABASE_URL) {
	const holder = readLockHolder(dataDir);
	if (holder)
		fail(
			`The data directory ${dataDir} is in use by process ${holder}. Stop it first, or set DATA_DIR.`
		);
}
mkdirSync(dataDir, { recursive: true });

function newestMtime(path) {
	if (!existsSync(path)) return 0;
	const stat = statSync(path);
	if (!stat.isDirectory()) return stat.mtimeMs;
	let newest = stat.mtimeMs;
	for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
	return newest;
}

const sources = [
	'src',
	'static',
	'drizzle',
	'svelte.config.js',
	'vite.config.ts',
	'package-lock.json'
];
const buildDir = env.BUILD_DIR || 'build';
const builtAt = existsSync(`${buildDir}/handler.js`)
	? statSync(`${buildDir}/handler.js`).mtimeMs
	: 0;
if (builtAt === 0 || Math.max(...sources.map(newestMtime)) > builtAt) {
	say('building the app (sources changed since the last build)…');
	const build = spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build'], {
		encoding: 'utf8'
	});
	if (build.status !== 0) {
		process.stderr.write(build.stdout + build.stderr);
		fail('the build failed: see the messages above');
	}
}

const secretFile = join(dataDir, 'auth-secret');
if (!env.AUTH_SECRET) {
	if (!existsSync(secretFile))
		writeFileSync(secretFile, randomBytes(32).toString('base64url'), { mode: 0o600 });
	env.AUTH_SECRET = readFileSync(secretFile, 'utf8').trim();
}

const running = [];
const closers = [];

if (!env.S3_ENDPOINT) {
	const { startS3Fake } = await import('../fakes/s3.js');
	env.S3_BUCKET ||= 'checkplate';
	env.S3_ACCESS_KEY_ID = 'S3RVER';
	env.S3_SECRET_ACCESS_KEY = 'S3RVER';
	const s3 = await startS3Fake({
		port: Number(env.S3_FAKE_PORT || 0),
		directory: join(dataDir, 's3'),
		bucket: env.S3_BUCKET
	}).catch((err) => fail(`the S3 stand-in could not start: ${err.message}`));
	env.S3_ENDPOINT = s3.endpoint;
	closers.push(s3.close);
	running.push(
		`S3 stand-in     ${s3.endpoint} (bucket ${env.S3_BUCKET}, files in ${join(dataDir, 's3')})`
	);
}

if (!env.SMTP_URL) {
	const { startSmtpFake } = await import('../fakes/smtp.js');
	const mailDir = join(dataDir, 'mail');
	const smtp = await startSmtpFake({
		port: Number(env.SMTP_FAKE_PORT || 0),
		directory: mailDir
	}).catch((err) => fail(`the mail stand-in could not start: ${err.message}`));
	env.SMTP_URL = smtp.url;
	env.MAIL_FAKE_DIR = mailDir;
	closers.push(smtp.close);
	running.push(
		isLoopbackHost(host)
			? `mail stand-in   ${smtp.url} (caught mail at /dev/mail)`
			: `mail stand-in   ${smtp.url} (caught mail in ${mailDir})`
	);
}

const publicHost =
	!env.HOST || host === '0.0.0.0' || host === '::'
		? 'localhost'
		: host.includes(':')
			? `[${host}]`
			: host;
env.PORT = String(port);
env.HOST = host;
env.ORIGIN ||= `http://${publicHost}:${port}`;
env.AUTH_TRUST_HOST ||= 'true';
env.DATA_DIR = dataDir;
env.BODY_SIZE_LIMIT ||= `${Number(env.MAX_UPLOAD_MB || 100) + 1}M`;

const app = spawn(process.execPath, [`${buildDir}/index.js`], {
	env,
	stdio: ['ignore', 'inherit', 'inherit']
});
let stopping = false;

async function stop(code) {
	if (stopping) return;
	stopping = true;
	if (app.exitCode === null) {
		app.kill('SIGTERM');
		const forced = setTimeout(() => app.kill('SIGKILL'), 10_000);
		await new Promise((done) => app.once('exit', done));
		clearTimeout(forced);
	}
	await Promise.allSettled(closers.map((close) => close()));
	process.exit(code);
}

app.once('exit', (code) => {
	if (!stopping) {
		console.error(`[checkplate] the app stopped (exit code ${code})`);
		void stop(code || 1);
	}
});
process.once('SIGINT', () => void stop(0));
process.once('SIGTERM', () => void stop(0));
// A closed terminal must not leave the app holding the data directory.
process.once('SIGHUP', () => void stop(0));

const url = env.ORIGIN;
// Migrations and the demo seed can take a while on a busy machine: wait for the first answer
// (up to three minutes) before saying the app runs, and stop if it never answers.
let answered = false;
for (const deadline = Date.now() + 180_000; !answered && !stopping && Date.now() < deadline;) {
	try {
		answered = (await fetch(`http://127.0.0.1:${port}/`)).ok;
	} catch {
		// not listening yet
	}
	if (!answered) await new Promise((done) => setTimeout(done, 100));
}
if (!answered && !stopping) {
	console.error('[checkplate] the app did not answer within three minutes: stopping');
	void stop(1);
}
if (answered && !stopping) {
	say(
		`database        ${env.DATABASE_URL ? 'PostgreSQL server (DATABASE_URL)' : `embedded, in ${join(dataDir, 'pglite')}`}`
	);
	for (const line of running) say(line);
	if (mailStandIn && !isLoopbackHost(host)) {
		const bar = '!'.repeat(78);
		console.log(
			[
				bar,
				`!! The app listens on ${host}, beyond this machine, with the mail stand-in: caught mail`,
				'!! cannot be read at /dev/mail here (it answers 404), since it holds sign-in and reset',
				`!! links. Read it in ${join(dataDir, 'mail')}, set SMTP_URL for real mail, or start`,
				'!! with HOST=127.0.0.1 to read it in the browser.',
				bar
			].join('\n')
		);
	}
	say(`Checkplate is running at ${url}   (Ctrl-C stops everything)`);
}
