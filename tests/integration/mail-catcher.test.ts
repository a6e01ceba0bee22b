// The local mail catcher outlives a client that drops its connection: a reset mid-conversation
// once ended the whole catcher (an unhandled 'error' event), and every later mail of the run was
// refused. Here a raw SMTP client is reset inside a transaction, then a real message must arrive.
import net from 'node:net';
import { describe, expect, it } from 'vitest';
import { inboxFor, uniqueEmail } from './support/auth-helpers';
import { passwordResetMail, sendMail } from '../../src/lib/server/mail';

/** Opens a transaction (EHLO, MAIL FROM, RCPT TO), then resets the connection. */
function resetMidTransaction(url: URL): Promise<void> {
	return new Promise((resolve, reject) => {
		const socket = net.connect(Number(url.port), url.hostname);
		socket.once('error', reject);
		const steps = [
			'EHLO dropping.test',
			'MAIL FROM:<a@dropping.test>',
			'RCPT TO:<b@dropping.test>'
		];
		socket.on('data', (chunk) => {
			// Each reply (greeting, then one per command) lets the next command go.
			if (!/^\d{3} /m.test(chunk.toString())) return;
			const next = steps.shift();
			if (next) socket.write(`${next}\r\n`);
			else {
				// RST instead of FIN, inside the transaction: the catcher sees ECONNRESET.
				socket.resetAndDestroy();
				resolve();
			}
		});
	});
}

describe('mail catcher', () => {
	it('keeps catching after a client resets its connection', async () => {
		const smtp = process.env.SMTP_URL;
		if (!smtp) throw new Error('SMTP_URL is not set: run through `npm test`');
		for (let i = 0; i < 3; i++) await resetMidTransaction(new URL(smtp));
		await new Promise((resolve) => setTimeout(resolve, 200));
		const to = uniqueEmail('after-reset');
		await sendMail({
			to,
			...passwordResetMail({ name: 'Ana', url: 'http://x/r/1', expiresMinutes: 30 })
		});
		const [mail] = await inboxFor(to);
		expect(mail.text).toContain('http://x/r/1');
	});
});
