// The three messages through the real SMTP path into the local catcher: plain text and HTML,
// names escaped, links intact, no remote resources.
import { describe, expect, it } from 'vitest';
import { inboxFor, uniqueEmail } from './support/auth-helpers';
import { invitationMail, passwordResetMail, sendMail, sheetSharedMail } from '../../src/lib/server/mail';

describe('mail', () => {
	it('sends an invitation whose HTML shows a name with markup as text', async () => {
		const to = uniqueEmail('mail-invite');
		const url = 'http://127.0.0.1:4173/invitations/abc?x=1&y=2';
		await sendMail({ to, ...invitationMail({ inviterName: '<img src=x onerror=alert(1)>', workspaceName: 'Bench & "Lab"', role: 'admin', url }) });
		const [mail] = await inboxFor(to);
		expect(mail.subject).toBe('<img src=x onerror=alert(1)> invited you to Bench & "Lab" on Polewise');
		expect(mail.text).toContain('as an admin');
		expect(mail.text).toContain(url);
		expect(mail.html).not.toContain('<img');
		expect(mail.html).toContain('&lt;img src=x onerror=alert(1)&gt;');
		expect(mail.html).toContain('Bench &amp; &quot;Lab&quot;');
		expect(mail.html).toContain('href="http://127.0.0.1:4173/invitations/abc?x=1&amp;y=2"');
		expect(mail.html).not.toMatch(/src=["']?http/);
	});

	it('words the reset and sharing messages and keeps subjects on one line', () => {
		expect(passwordResetMail({ name: 'Ana', url: 'http://x/r/1', expiresMinutes: 30 }).text).toContain('expires 30 minutes after');
		const shared = sheetSharedMail({ sharerName: 'Ana\r\nBcc: someone@example.test', sheetName: 'Probe', role: 'commenter', url: 'http://x/s/1' });
		expect(shared.subject).not.toMatch(/[\r\n]/);
		expect(shared.text).toContain('as a commenter');
	});
});
