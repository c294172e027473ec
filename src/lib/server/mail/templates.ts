import type { QueuedMail } from './outbox';

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** One plain layout for every message: a sentence, a button-like link, and why it was sent. */
function linkMail(
	kind: string,
	to: string,
	subject: string,
	lead: string,
	action: string,
	url: string,
	footnote: string
): QueuedMail {
	const html = `<!doctype html><html><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>
<body style="font-family: 'Noto Sans', Arial, sans-serif; color: #1f2933; max-width: 560px; margin: 24px auto;">
<p style="font-weight: 600;">Checkplate</p>
<p>${escapeHtml(lead)}</p>
<p><a href="${escapeHtml(url)}" style="display: inline-block; background: #1d5fa8; color: #fff; padding: 10px 16px; border-radius: 6px; text-decoration: none;">${escapeHtml(action)}</a></p>
<p style="font-size: 13px; color: #5f6b7a;">Or paste this address into your browser: ${escapeHtml(url)}</p>
<p style="font-size: 13px; color: #5f6b7a;">${escapeHtml(footnote)}</p>
</body></html>`;
	const text = `${lead}\n\n${action}: ${url}\n\n${footnote}\n`;
	return { kind, to, subject, html, text };
}

export const verificationMail = (to: string, url: string) =>
	linkMail(
		'verify-email',
		to,
		'Confirm your e-mail address for Checkplate',
		'Someone, hopefully you, created a Checkplate account with this address.',
		'Confirm my address',
		url,
		'The link works once and for 24 hours. If you did not sign up, ignore this message.'
	);

export const passwordResetMail = (to: string, url: string) =>
	linkMail(
		'reset-password',
		to,
		'Choose a new Checkplate password',
		'A new password was asked for on your Checkplate account.',
		'Choose a new password',
		url,
		'The link works once and for one hour; using it signs you out everywhere else. If you did not ask, ignore this message: your password stays as it is.'
	);

export const signInLinkMail = (to: string, url: string) =>
	linkMail(
		'sign-in-link',
		to,
		'Your Checkplate sign-in link',
		'Use this link to sign in to Checkplate.',
		'Sign in',
		url,
		'The link works once and for 15 minutes. If you did not ask for it, ignore this message.'
	);

export const invitationMail = (
	to: string,
	url: string,
	team: string,
	inviter: string,
	role: string
) =>
	linkMail(
		'invitation',
		to,
		`${inviter} invited you to ${team} on Checkplate`,
		`${inviter} invited you to review drawings with ${team} on Checkplate, as ${role}.`,
		'Accept the invitation',
		url,
		'The invitation works once and for 7 days. If you did not expect it, ignore this message.'
	);
