import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createMailer } from '../../src/lib/server/mail';
import { listCaughtMail } from '../../src/lib/server/mail/caught';
import { startFakes } from './harness';

let fakes: Awaited<ReturnType<typeof startFakes>>;

beforeAll(async () => {
	fakes = await startFakes();
});
afterAll(() => fakes?.stop());

describe('mail through the SMTP stand-in', () => {
	it('delivers a message that the stand-in keeps with its HTML and Message-ID', async () => {
		const mailer = createMailer(fakes.smtpUrl, 'Checkplate <checkplate@example.test>');
		await mailer.send({
			to: 'checker@example.test',
			subject: 'KF-1001 rev B is ready for check',
			text: 'Open https://checkplate.example.test/x',
			html: '<p>Open <a href="https://checkplate.example.test/x">the revision</a></p>',
			messageId: '<notification-1@checkplate.example.test>'
		});
		mailer.close();
		const caught = await listCaughtMail(fakes.mailDir);
		expect(caught).toHaveLength(1);
		expect(caught[0].subject).toBe('KF-1001 rev B is ready for check');
		expect(caught[0].to).toEqual(['checker@example.test']);
		expect(caught[0].html).toContain('href="https://checkplate.example.test/x"');
		expect(caught[0].messageId).toBe('<notification-1@checkplate.example.test>');
	});
});
