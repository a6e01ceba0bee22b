// A mail catcher for local runs and tests: accepts any message over SMTP on loopback, keeps the
// newest 500 in memory, and shows them at a small inbox page with a JSON API for the tests:
//   GET /api/messages            newest first: { id, from, to, subject, date, text, html }
//   GET /api/messages?to=ADDR    only those addressed to ADDR
//   DELETE /api/messages         empty the inbox
import http from 'node:http';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';

const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 54325);
const webPort = Number(process.env.MAIL_FAKE_WEB_PORT ?? 54326);
const LIMIT = 500;

interface Caught {
	id: number;
	from: string;
	to: string[];
	subject: string;
	date: string;
	text: string;
	html: string | null;
}

const inbox: Caught[] = [];
let nextId = 1;

const addresses = (field: AddressObject | AddressObject[] | undefined) =>
	(Array.isArray(field) ? field : field ? [field] : []).flatMap((a) => a.value.map((v) => (v.address ?? '').toLowerCase()));

const smtp = new SMTPServer({
	authOptional: true,
	disabledCommands: ['STARTTLS'],
	size: 10 * 1024 * 1024,
	onData(stream, _session, callback) {
		simpleParser(stream)
			.then((mail) => {
				inbox.unshift({
					id: nextId++,
					from: addresses(mail.from)[0] ?? '',
					to: addresses(mail.to),
					subject: mail.subject ?? '',
					date: (mail.date ?? new Date()).toISOString(),
					text: mail.text ?? '',
					html: typeof mail.html === 'string' ? mail.html : null
				});
				inbox.length = Math.min(inbox.length, LIMIT);
				callback();
			})
			.catch((error) => callback(error));
	}
});

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function page(messages: Caught[]): string {
	const rows = messages
		.map((m) => `<article><h2>${escape(m.subject)}</h2><p class="meta">to ${escape(m.to.join(', '))} · from ${escape(m.from)} · ${escape(m.date)}</p><pre>${escape(m.text)}</pre></article>`)
		.join('');
	return `<!doctype html><meta charset="utf-8"><title>Polewise local inbox</title><style>body{font:15px system-ui;margin:2rem auto;max-width:52rem;padding:0 1rem}article{border-top:1px solid #ccc;padding:.5rem 0}.meta{color:#666;font-size:13px}pre{white-space:pre-wrap}</style><h1>Local inbox (${messages.length})</h1><p>Mail the app sent on this machine. Nothing here left the computer.</p>${rows || '<p>No mail yet.</p>'}`;
}

const web = http.createServer((request, response) => {
	const url = new URL(request.url ?? '/', `http://127.0.0.1:${webPort}`);
	if (url.pathname === '/api/messages' && request.method === 'DELETE') {
		inbox.length = 0;
		response.writeHead(204).end();
		return;
	}
	const to = url.searchParams.get('to')?.toLowerCase();
	const messages = to ? inbox.filter((m) => m.to.includes(to)) : inbox;
	if (url.pathname === '/api/messages') {
		response.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(messages));
		return;
	}
	if (url.pathname === '/') {
		response.writeHead(200, { 'content-type': 'text/html; charset=utf-8' }).end(page(messages));
		return;
	}
	response.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
});

// A client that drops its connection mid-conversation (a process shutting down, a test's
// mailer closed early) reaches the server as an 'error' event; without a listener Node ends the
// whole catcher and every later mail is lost. One connection's trouble is not the catcher's.
smtp.on('error', (error: NodeJS.ErrnoException) => {
	if (error.code !== 'ECONNRESET' && error.code !== 'EPIPE')
		process.stderr.write(`[mail catcher] ${error.message}\n`);
});
smtp.listen(smtpPort, '127.0.0.1');
web.listen(webPort, '127.0.0.1');
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
	process.on(signal, () => {
		smtp.close(() => undefined);
		web.close();
		process.exit(0);
	});
}
