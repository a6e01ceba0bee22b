// Telling people: an in-app notification, a nudge on their own live channel (the bell updates
// without a reload), and an e-mail through the same mailer as the account messages. Mail goes
// out after the response: a slow mail server must not hold up a comment.
import { addNotifications } from '../db/notifications';
import type { NotificationKind } from '../db/models/notification';
import { sendMail } from '../mail';
import type { MailContent } from '../mail/templates';
import { publish, userChannel } from '../live/events';

export interface Recipient {
	id: string;
	email: string;
	name: string;
}

export async function notify(input: {
	recipients: Recipient[];
	kind: NotificationKind;
	actorId: string;
	sheetId: string | null;
	detail: Record<string, unknown>;
	mail?: (r: Recipient) => MailContent;
}): Promise<void> {
	const people = input.recipients.filter((r, i, all) => r.id !== input.actorId && all.findIndex((x) => x.id === r.id) === i);
	if (people.length === 0) return;
	await addNotifications(people.map((r) => ({ userId: r.id, kind: input.kind, actorId: input.actorId, sheetId: input.sheetId, detail: input.detail })));
	await Promise.all(people.map((r) => publish(userChannel(r.id), 'notification', { notificationKind: input.kind, sheetId: input.sheetId })));
	const mail = input.mail;
	if (mail) {
		for (const r of people) {
			sendMail({ to: r.email, ...mail(r) }).catch((e) => console.error(`[mail] could not send a ${input.kind} notice to ${r.email}:`, e));
		}
	}
}
