// The local stand-in for a hosted mail service: an SMTP catcher on loopback with a small inbox
// page. Skipped when SMTP_URL points at a real server.
import { SetupError, step } from './log.mjs';
import { isPortFree } from './ports.mjs';
import { startChild, tsx } from './services.mjs';

// Starting means tsx compiling the script and loading smtp-server and mailparser: under a second on
// a quiet machine, but well over 15 s on a loaded 2-core one with a cold compile cache (a fresh
// clone). Waiting ends as soon as it answers or exits; the limit is only there against a hang.
async function waitFor(url, child, timeoutMs = 120_000) {
	const deadline = Date.now() + timeoutMs;
	while (Date.now() < deadline) {
		if (child.exitCode !== null) throw new SetupError('The local mail catcher exited during start-up.');
		try {
			const response = await fetch(url);
			if (response.ok) return;
		} catch {
			/* not listening yet */
		}
		await new Promise((r) => setTimeout(r, 150));
	}
	throw new SetupError(`The local mail catcher did not answer at ${url} within ${timeoutMs / 1000} s.`);
}

export async function startMailFake(root, { mailPort, mailWebPort }, children, { quiet = false } = {}) {
	if (process.env.SMTP_URL) return { env: {}, inboxUrl: null };
	for (const port of [mailPort, mailWebPort]) {
		if (!(await isPortFree(port))) {
			throw new SetupError(
				`Port ${port} on 127.0.0.1 is in use, so the local mail catcher cannot start.`,
				'Stop that program, or set POLEWISE_MAIL_PORT / POLEWISE_MAIL_WEB_PORT to free ports.'
			);
		}
	}
	if (!quiet) step(`Starting the local mail catcher (SMTP 127.0.0.1:${mailPort})`);
	const child = startChild(root, tsx(root), ['scripts/mail-fake.ts'], {
		MAIL_FAKE_SMTP_PORT: String(mailPort),
		MAIL_FAKE_WEB_PORT: String(mailWebPort)
	}, { name: 'mail', stdio: ['ignore', 'ignore', 'inherit'] });
	children.push(child);
	const inboxUrl = `http://127.0.0.1:${mailWebPort}`;
	await waitFor(`${inboxUrl}/api/messages`, child);
	return {
		env: { SMTP_URL: `smtp://127.0.0.1:${mailPort}`, MAIL_INBOX_URL: inboxUrl },
		inboxUrl
	};
}
