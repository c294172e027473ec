import { dev } from '$app/environment';
import { env } from '$env/dynamic/private';
import { isLoopbackHost } from './loopback.js';

/** Settings read from the environment; every one is documented in .env.example. */
export const config = {
	get dataDir() {
		return env.DATA_DIR || './data';
	},
	get s3() {
		return {
			endpoint: required('S3_ENDPOINT'),
			bucket: required('S3_BUCKET'),
			region: env.S3_REGION || 'us-east-1',
			accessKeyId: required('S3_ACCESS_KEY_ID'),
			secretAccessKey: required('S3_SECRET_ACCESS_KEY')
		};
	},
	get smtpUrl() {
		return required('SMTP_URL');
	},
	get mailFrom() {
		return env.MAIL_FROM || 'Checkplate <checkplate@localhost>';
	},
	get maxUploadBytes() {
		return Number(env.MAX_UPLOAD_MB || 100) * 1024 * 1024;
	},
	/** Largest request body of every route but the upload (`BODY_LIMIT_KB`, default 1024). */
	get maxBodyBytes() {
		return Number(env.BODY_LIMIT_KB || 1024) * 1024;
	},
	/** Limits of the PDF content check (see pdf.ts): pages, seconds and worker memory. */
	get pdfLimits() {
		return {
			maxPages: Number(env.MAX_PDF_PAGES || 1000),
			timeoutMs: Number(env.PDF_CHECK_SECONDS || 60) * 1000,
			memoryMb: Number(env.PDF_CHECK_MEMORY_MB || 512)
		};
	},
	get uploadTempDir() {
		return `${env.DATA_DIR || './data'}/tmp`;
	},
	/** Whether the app answers this machine alone (adapter-node binds `HOST`, 0.0.0.0 unless set). */
	get listensOnLoopbackOnly() {
		return isLoopbackHost(env.HOST || (dev ? 'localhost' : '0.0.0.0'));
	},
	/** Set by `npm start` when the mail fake is in use: where it keeps what it caught. */
	get mailFakeDir() {
		return env.MAIL_FAKE_DIR || null;
	}
};

function required(name: string): string {
	const value = env[name];
	if (!value) {
		throw new Error(
			`Setting ${name} is missing: see .env.example (npm start sets it for the fakes)`
		);
	}
	return value;
}
