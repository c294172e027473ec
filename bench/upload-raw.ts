// Child process for bench/upload.ts: puts a file straight into the bucket with lib-storage and
// reports its own time and peak memory growth, measured the same way as the app's.
import { createReadStream } from 'node:fs';
import { S3Client } from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { peakGrowth, resetPeak, rssBytes } from './memory';

const [endpoint, bucket, path] = process.argv.slice(2);
const client = new S3Client({
	endpoint,
	region: 'us-east-1',
	forcePathStyle: true,
	credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
	requestChecksumCalculation: 'WHEN_REQUIRED',
	responseChecksumValidation: 'WHEN_REQUIRED'
});
const baseline = rssBytes(process.pid);
resetPeak(process.pid);
const started = performance.now();
await new Upload({
	client,
	params: { Bucket: bucket, Key: 'bench/raw.pdf', Body: createReadStream(path) },
	queueSize: 2,
	partSize: 8 * 1024 * 1024
}).done();
const seconds = (performance.now() - started) / 1000;
console.log(JSON.stringify({ seconds, growth: peakGrowth(process.pid, baseline) }));
