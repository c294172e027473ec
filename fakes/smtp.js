// A local SMTP server that accepts every message and keeps it as JSON for the /dev/mail page.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

/** @param {import('mailparser').AddressObject | import('mailparser').AddressObject[] | undefined} field */
function addresses(field) {
	if (!field) return [];
	return (Array.isArray(field) ? field : [field]).flatMap((group) =>
		group.value.map((a) => a.address ?? '')
	);
}

/**
 * @param {{ port: number, directory: string, host?: string }} options
 * @returns {Promise<{ url: string, port: number, close: () => Promise<void> }>}
 */
export async function startSmtpFake({ port, directory, host = '127.0.0.1' }) {
	mkdirSync(directory, { recursive: true });
	const server = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS'],
		logger: false,
		onData(stream, session, callback) {
			simpleParser(stream)
				.then((mail) => {
					const caught = {
						id: randomUUID(),
						receivedAt: new Date().toISOString(),
						messageId: mail.messageId ?? null,
						from:
							addresses(mail.from)[0] ??
							(session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
						to: session.envelope.rcptTo.map((r) => r.address),
						headerTo: addresses(mail.to),
						subject: mail.subject ?? '',
						text: mail.text ?? '',
						html: typeof mail.html === 'string' ? mail.html : ''
					};
					const name = `${caught.receivedAt.replace(/[:.]/g, '-')}-${caught.id}.json`;
					writeFileSync(join(directory, name), JSON.stringify(caught, null, 1));
					callback();
				})
				.catch((err) => callback(err));
		}
	});
	await new Promise((resolve, reject) => {
		server.once('error', reject);
		server.listen(port, host, () => resolve(undefined));
	});
	const address = /** @type {import('node:net').AddressInfo} */ (server.server.address());
	return {
		url: `smtp://${host}:${address.port}`,
		port: address.port,
		close: () => new Promise((resolve) => server.close(() => resolve(undefined)))
	};
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const fake = await startSmtpFake({
		port: Number(process.env.SMTP_FAKE_PORT || 2525),
		directory: process.env.MAIL_FAKE_DIR || './data/mail'
	});
	console.log(`SMTP fake on ${fake.url}`);
}
