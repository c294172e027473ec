// A local S3-compatible store for development and tests (s3rver), keeping objects on disk.
import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import { join } from 'node:path';
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
	// s3rver answers AbortMultipartUpload with 405 and keeps the parts: do what S3 does, drop them.
	server.middleware.unshift(
		/**
		 * @param {{ method: string, path: string, query: Record<string, unknown>, status: number }} ctx
		 * @param {() => Promise<void>} next
		 */
		async (ctx, next) => {
			const uploadId = ctx.query.uploadId;
			if (
				ctx.method !== 'DELETE' ||
				typeof uploadId !== 'string' ||
				!/^[0-9a-f]+$/.test(uploadId)
			) {
				return next();
			}
			const bucketName = ctx.path.split('/')[1];
			if (!/^[a-z0-9-]+$/.test(bucketName)) return next();
			const uploads = server.store.getResourcePath(bucketName, undefined, 'uploads');
			await rm(join(uploads, uploadId), { recursive: true, force: true });
			ctx.status = 204;
		}
	);
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
