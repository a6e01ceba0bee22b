// Comment text: a small, safe subset of Markdown. marked turns it into HTML with raw HTML turned
// into visible text (not passed through), images shown as their alt text and headings as bold
// lines; sanitize-html then keeps only an allow-list of tags and attributes, so even a marked
// bug cannot let a script, a style, an event handler or a javascript: link reach a page.
import { Marked, type Tokens, type TokenizerAndRendererExtension } from 'marked';
import sanitizeHtml from 'sanitize-html';
import { escapeHtml } from '../mail/templates';
import { MENTION_AT, type MentionResolver } from './mentions';

export const BODY_LIMIT = 4000;

const ALLOWED: sanitizeHtml.IOptions = {
	allowedTags: ['p', 'br', 'strong', 'em', 'del', 'code', 'pre', 'blockquote', 'ul', 'ol', 'li', 'a', 'span', 'hr', 'table', 'thead', 'tbody', 'tr', 'th', 'td'],
	allowedAttributes: { a: ['href', 'title', 'rel', 'target'], span: ['class', 'data-user-id'], ol: ['start'], th: ['align'], td: ['align'] },
	allowedClasses: { span: ['pw-mention'] },
	allowedSchemes: ['http', 'https', 'mailto'],
	allowedSchemesAppliedToAttributes: ['href'],
	allowProtocolRelative: false,
	disallowedTagsMode: 'discard',
	transformTags: { a: sanitizeHtml.simpleTransform('a', { rel: 'nofollow noopener noreferrer', target: '_blank' }) }
};

/** The last line of defence, also used on its own by tests: anything in, allow-listed HTML out. */
export function sanitize(html: string): string {
	return sanitizeHtml(html, ALLOWED);
}

function mentionExtension(resolve: MentionResolver, found: Map<string, string>): TokenizerAndRendererExtension {
	return {
		name: 'mention',
		level: 'inline',
		start: (src) => {
			const i = src.search(/@[\w.+-]/);
			return i < 0 ? undefined : i;
		},
		tokenizer(src) {
			const m = MENTION_AT.exec(src);
			if (!m) return undefined;
			const person = resolve(m[1]);
			if (!person) return undefined;
			found.set(person.id, person.name);
			return { type: 'mention', raw: m[0], userId: person.id, name: person.name };
		},
		renderer: (token) => `<span class="pw-mention" data-user-id="${escapeHtml(String(token.userId))}">@${escapeHtml(String(token.name))}</span>`
	};
}

export interface Rendered {
	html: string;
	/** The people the text mentions, by id (each once). */
	mentions: string[];
}

export function renderComment(body: string, resolve: MentionResolver = () => null): Rendered {
	const found = new Map<string, string>();
	const marked = new Marked({ gfm: true, breaks: true, async: false });
	marked.use({
		extensions: [mentionExtension(resolve, found)],
		renderer: {
			html: (token: Tokens.HTML | Tokens.Tag) => escapeHtml(token.text),
			image: (token: Tokens.Image) => escapeHtml(token.text || token.href),
			heading(token: Tokens.Heading) {
				return `<p><strong>${this.parser.parseInline(token.tokens)}</strong></p>\n`;
			}
		}
	});
	const html = sanitize(marked.parse(body) as string).trim();
	return { html, mentions: [...found.keys()] };
}
