import nodemailer from 'nodemailer';

export interface MailMessage {
	to: string | string[];
	subject: string;
	html: string;
	text: string;
	messageId?: string;
}

export function createMailer(smtpUrl: string, from: string) {
	const transport = nodemailer.createTransport(smtpUrl);
	return {
		async send(message: MailMessage) {
			const info = await transport.sendMail({ from, ...message });
			return { messageId: info.messageId, accepted: info.accepted };
		},
		close: () => transport.close()
	};
}

export type Mailer = ReturnType<typeof createMailer>;
