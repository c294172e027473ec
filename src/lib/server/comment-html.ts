/*
 * A comment's small text format: paragraphs, lists, emphasis, code, quotes and links, written
 * as Markdown (markdown-it) and sanitized (sanitize-html) before anyone sees it. Raw HTML in a
 * comment is never trusted: markdown-it writes it out as text, and the sanitizer keeps only the
 * tags below, whatever the renderer produced.
 */
import MarkdownIt from 'markdown-it';
import type StateInline from 'markdown-it/lib/rules_inline/state_inline.mjs';
import sanitizeHtml from 'sanitize-html';

/** Someone a comment may mention: a member of the team. */
export interface Mentionable {
	userId: string;
	name: string | null;
	email: string;
}

const mentionToken = /^@([A-Za-z0-9][\w.-]*)/;

/**
 * `@word` names a member when the word is, ignoring case, the local part of their e-mail
 * address (`@checker`), their name without spaces (`@PriyaNatarajan`) or their first name
 * (`@priya`) when no other member shares it. Anything else stays plain text.
 */
export function mentionResolver(members: readonly Mentionable[]) {
	const byWord = new Map<string, Mentionable | null>();
	const add = (word: string, member: Mentionable) => {
		const key = word.toLowerCase();
		const known = byWord.get(key);
		// Two members answering to one word: the word names neither.
		byWord.set(key, known === undefined || known?.userId === member.userId ? member : null);
	};
	for (const member of members) add(member.email.split('@')[0], member);
	// Full names and first names only where no e-mail local part already claims the word.
	const taken = new Set(byWord.keys());
	for (const member of members) {
		const name = member.name?.trim();
		if (!name) continue;
		const joined = name.replace(/\s+/g, '');
		if (!taken.has(joined.toLowerCase())) add(joined, member);
		const first = name.split(/\s+/)[0];
		if (!taken.has(first.toLowerCase())) add(first, member);
	}
	return (word: string) => byWord.get(word.toLowerCase()) ?? null;
}

type Resolve = ReturnType<typeof mentionResolver>;

function mentionRule(state: StateInline, silent: boolean) {
	if (state.src.charCodeAt(state.pos) !== 0x40 /* @ */) return false;
	// An address such as name@example.test is not a mention.
	if (state.pos > 0 && /[\w.@]/.test(state.src[state.pos - 1])) return false;
	const match = mentionToken.exec(state.src.slice(state.pos));
	if (!match) return false;
	// Trailing dots and dashes end a sentence, not a name.
	const word = match[1].replace(/[.-]+$/, '');
	const member = (state.env as { resolve: Resolve }).resolve(word);
	if (!member) return false;
	if (!silent) {
		const token = state.push('mention', '', 0);
		token.content = word;
		token.meta = { userId: member.userId, name: member.name ?? member.email };
		(state.env as { mentioned: Set<string> }).mentioned.add(member.userId);
	}
	state.pos += word.length + 1;
	return true;
}

const markdown = new MarkdownIt('default', { html: false, linkify: true, breaks: true });
// Comments are not documents: no headings, rules, tables or pictures.
markdown.disable(['heading', 'lheading', 'hr', 'table', 'image']);
markdown.inline.ruler.before('emphasis', 'mention', mentionRule);
markdown.renderer.rules.mention = (tokens, i) => {
	const { userId, name } = tokens[i].meta as { userId: string; name: string };
	const escape = markdown.utils.escapeHtml;
	return `<span class="mention" data-user-id="${escape(userId)}" title="${escape(name)}">@${escape(tokens[i].content)}</span>`;
};

const allowed: sanitizeHtml.IOptions = {
	allowedTags: [
		'p',
		'br',
		'ul',
		'ol',
		'li',
		'em',
		'strong',
		's',
		'code',
		'pre',
		'blockquote',
		'a',
		'span'
	],
	allowedAttributes: {
		a: ['href', 'rel', 'target'],
		ol: ['start'],
		span: ['class', 'data-user-id', 'title']
	},
	allowedClasses: { span: ['mention'] },
	allowedSchemes: ['http', 'https', 'mailto'],
	allowProtocolRelative: false,
	disallowedTagsMode: 'escape',
	transformTags: {
		a: sanitizeHtml.simpleTransform('a', {
			rel: 'nofollow noopener noreferrer',
			target: '_blank'
		})
	}
};

/** Safe HTML from any string: the tags of the comment format only, scripts and handlers gone. */
export const sanitize = (html: string) => sanitizeHtml(html, allowed);

/** A comment's body as sanitized HTML, and the members it mentions. */
export function renderComment(body: string, members: readonly Mentionable[]) {
	const env = { resolve: mentionResolver(members), mentioned: new Set<string>() };
	const html = sanitize(markdown.render(body, env));
	return { html, mentions: [...env.mentioned] };
}
