// A local S3-compatible store for development and tests (s3rver), keeping objects on disk.
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

/**
 * @param {{ port: number, directory: string, bucket: string, host?: string }} options
 * @returns {Promise<{ endpoint: string, port: number, close: () => Promise<void> }>}
 */
export async function startS3Fake({ port, directory, bucket, host = '127.0.0.1' }) {
	mkdirSync(directory, { recursive: true });
	const server = new S3rver({
		port,
		address: host,
		silent: true,
		directory,
		configureBuckets: [{ name: bucket }]
	});
	const { port: boundPort } = await server.run();
	return {
		endpoint: `http://${host}:${boundPort}`,
		port: boundPort,
		close: () => server.close()
	};
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const fake = await startS3Fake({
		port: Number(process.env.S3_FAKE_PORT || 9000),
		directory: process.env.S3_FAKE_DIR || './data/s3',
		bucket: process.env.S3_BUCKET || 'checkplate'
	});
	console.log(`S3 fake on ${fake.endpoint}`);
}
