// The messages Polewise sends: plain text first, and a simple HTML twin with the same words.
// No images, no remote resources, no tracking links; every name is HTML-escaped because people
// choose their own names (and workspace and sheet names).
export interface MailContent {
	subject: string;
	text: string;
	html: string;
}

export function escapeHtml(value: string): string {
	return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);
}

/** Subjects are one line: no CR/LF from a user-chosen name may reach the header. */
const oneLine = (value: string) => value.replace(/[\r\n]+/g, ' ').trim();

const article = (role: string) => (/^[aeiou]/i.test(role) ? 'an' : 'a');

export interface Parts {
	subject: string;
	/** Paragraphs of plain text; the HTML escapes them. */
	paragraphs: string[];
	action: { label: string; url: string };
	after: string[];
}

export function compose({ subject, paragraphs, action, after }: Parts): MailContent {
	const footer = 'Polewise — poles, zeros and time constants for analog front ends.';
	const text = [...paragraphs, `${action.label}:\n${action.url}`, ...after, '—', footer].join('\n\n') + '\n';
	const p = (s: string) => `<p style="margin:0 0 14px">${escapeHtml(s)}</p>`;
	const html = `<!doctype html><html><body style="margin:0;padding:24px;background:#f7f5ef;color:#212529;font:15px/1.5 system-ui,sans-serif">
<div style="max-width:34rem;margin:0 auto;background:#fffefa;border:1px solid #ddd7ca;border-radius:8px;padding:24px">
<p style="margin:0 0 18px;font-weight:600;font-size:17px">Polewise</p>
${paragraphs.map(p).join('\n')}
<p style="margin:20px 0"><a href="${escapeHtml(action.url)}" style="display:inline-block;background:#212529;color:#f7f5ef;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(action.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#686c72">If the button does not work, paste this address into your browser:<br>${escapeHtml(action.url)}</p>
${after.map(p).join('\n')}
<p style="margin:22px 0 0;font-size:12px;color:#686c72">${escapeHtml(footer)}</p>
</div></body></html>`;
	return { subject: oneLine(subject), text, html };
}

export function passwordResetMail({ name, url, expiresMinutes }: { name: string; url: string; expiresMinutes: number }): MailContent {
	return compose({
		subject: 'Reset your Polewise password',
		paragraphs: [`Hello ${name},`, 'Someone asked to reset the password of your Polewise account. To choose a new password, open the link below.'],
		action: { label: 'Choose a new password', url },
		after: [
			`The link works once and expires ${expiresMinutes} minutes after this message was sent. Choosing a new password signs your account out everywhere.`,
			'If you did not ask for this, ignore this message: your password stays as it is.'
		]
	});
}

export function invitationMail({ inviterName, workspaceName, role, url }: { inviterName: string; workspaceName: string; role: string; url: string }): MailContent {
	return compose({
		subject: `${inviterName} invited you to ${workspaceName} on Polewise`,
		paragraphs: [`${inviterName} invited you to join the workspace “${workspaceName}” on Polewise as ${article(role)} ${role}.`],
		action: { label: 'Accept the invitation', url },
		after: ['You can sign in or create an account on the way. If you were not expecting this, ignore this message.']
	});
}

export function sheetSharedMail({ sharerName, sheetName, role, url }: { sharerName: string; sheetName: string; role: string; url: string }): MailContent {
	return compose({
		subject: `${sharerName} shared “${sheetName}” with you on Polewise`,
		paragraphs: [`${sharerName} shared the sheet “${sheetName}” with you on Polewise. You can open it as ${article(role)} ${role}.`],
		action: { label: 'Open the sheet', url },
		after: ['If you were not expecting this, ignore this message.']
	});
}

export function signUpConfirmMail({ name, url, expiresMinutes }: { name: string; url: string; expiresMinutes: number }): MailContent {
	return compose({
		subject: 'Finish creating your Polewise account',
		paragraphs: [`Hello ${name},`, 'Someone — we hope you — asked to create a Polewise account with this address. To finish, open the link below.'],
		action: { label: 'Finish creating the account', url },
		after: [`The link works once and expires ${expiresMinutes} minutes after this message was sent.`, 'If you did not ask for this, ignore this message: no account is made.']
	});
}

/** To the owner of an address that already has an account, when someone signs up with it. */
export function signUpExistingMail({ name, signInUrl, resetUrl }: { name: string; signInUrl: string; resetUrl: string }): MailContent {
	return compose({
		subject: 'Someone tried to create a Polewise account with your address',
		paragraphs: [
			`Hello ${name},`,
			'Someone tried to create a new Polewise account with this address. It already belongs to your account, so nothing was created and nothing about your account changed.',
			'If it was you, sign in instead:'
		],
		action: { label: 'Sign in to Polewise', url: signInUrl },
		after: [`If you have forgotten your password, choose a new one here: ${resetUrl}`, 'If it was not you, you need not do anything.']
	});
}
