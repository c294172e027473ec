#!/usr/bin/env node
// A throwaway PostgreSQL server for tests and benchmarks: Debian's binaries, a cluster in a
// temp dir, a free port on 127.0.0.1, everything removed on stop.
//   node scripts/postgres.js                  start one, print its URL, Ctrl-C removes it
//   node scripts/postgres.js <command…>       run the command with TEST_DATABASE=postgres,
//                                             TEST_POSTGRES_URL and DATABASE_URL set
import { spawn, spawnSync } from 'node:child_process';
import { chownSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';

/** The newest `/usr/lib/postgresql/<version>/bin` holding initdb, or null when not installed. */
export function findPostgresBin(root = '/usr/lib/postgresql') {
	if (process.env.POSTGRES_BIN) return process.env.POSTGRES_BIN;
	if (!existsSync(root)) return null;
	const versions = readdirSync(root)
		.filter((version) => existsSync(join(root, version, 'bin', 'initdb')))
		.sort((a, b) => Number.parseFloat(b) - Number.parseFloat(a));
	return versions.length ? join(root, versions[0], 'bin') : null;
}

function freePort() {
	return new Promise((resolve, reject) => {
		const server = createServer();
		server.once('error', reject);
		server.listen(0, '127.0.0.1', () => {
			const { port } = /** @type {import('node:net').AddressInfo} */ (server.address());
			server.close(() => resolve(port));
		});
	});
}

/** @param {string} name */
function userIds(name) {
	const id = (/** @type {string} */ flag) =>
		Number(spawnSync('id', [flag, name], { encoding: 'utf8' }).stdout.trim());
	return { uid: id('-u'), gid: id('-g') };
}

/**
 * Starts a server and creates `database` on it. initdb refuses to run as root, so as root the
 * cluster belongs to the `postgres` user and every binary runs through runuser.
 */
export async function startPostgres({ database = 'checkplate' } = {}) {
	const bin = findPostgresBin();
	if (!bin) throw new Error('PostgreSQL is not installed: apt-get install -y postgresql');
	const asRoot = process.getuid?.() === 0;
	const dir = mkdtempSync(join(tmpdir(), 'checkplate-pg-'));
	if (asRoot) {
		const { uid, gid } = userIds('postgres');
		chownSync(dir, uid, gid);
	}
	const data = join(dir, 'data');
	const log = join(dir, 'server.log');
	/** @param {string} tool @param {string[]} args */
	const run = (tool, args) => {
		const command = asRoot ? 'runuser' : join(bin, tool);
		const all = asRoot ? ['-u', 'postgres', '--', join(bin, tool), ...args] : args;
		const result = spawnSync(command, all, { encoding: 'utf8', cwd: dir });
		if (result.status !== 0) {
			const serverLog = existsSync(log) ? readFileSync(log, 'utf8') : '';
			throw new Error(`${tool} failed: ${result.stderr || result.stdout}\n${serverLog}`);
		}
	};
	const remove = () => rmSync(dir, { recursive: true, force: true });
	try {
		run('initdb', ['-D', data, '-U', 'postgres', '-A', 'trust', '-E', 'UTF8', '--locale=C', '-N']);
		const port = await freePort();
		// fsync off: a test server's data is thrown away, durability buys nothing here.
		const options = `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off -c max_connections=200`;
		run('pg_ctl', ['-D', data, '-l', log, '-o', options, '-w', '-t', '60', 'start']);
		const server = `postgres://postgres@127.0.0.1:${port}`;
		const admin = new pg.Client({ connectionString: `${server}/postgres` });
		await admin.connect();
		await admin.query(`CREATE DATABASE "${database}"`);
		await admin.end();
		let stopped = false;
		return {
			url: `${server}/${database}`,
			serverUrl: server,
			port,
			dir,
			stop() {
				if (stopped) return;
				stopped = true;
				try {
					run('pg_ctl', ['-D', data, '-m', 'immediate', '-w', 'stop']);
				} finally {
					remove();
				}
			}
		};
	} catch (err) {
		spawnSync(asRoot ? 'runuser' : join(bin, 'pg_ctl'), [
			...(asRoot ? ['-u', 'postgres', '--', join(bin, 'pg_ctl')] : []),
			'-D',
			data,
			'-m',
			'immediate',
			'stop'
		]);
		remove();
		throw err;
	}
}

if (import.meta.filename === process.argv[1]) {
	const server = await startPostgres();
	const command = process.argv.slice(2);
	process.once('exit', () => server.stop());
	if (command.length === 0) {
		console.log(`[postgres] ${server.url}   (Ctrl-C stops and removes it)`);
		await new Promise((done) => {
			process.once('SIGINT', done);
			process.once('SIGTERM', done);
		});
		process.exit(0);
	} else {
		const child = spawn(command[0], command.slice(1), {
			stdio: 'inherit',
			env: {
				...process.env,
				TEST_DATABASE: 'postgres',
				TEST_POSTGRES_URL: server.url,
				DATABASE_URL: server.url
			}
		});
		process.once('SIGINT', () => child.kill('SIGINT'));
		child.once('exit', (code) => process.exit(code ?? 1));
	}
}
