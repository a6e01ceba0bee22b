// The review messages: mentions, review requests and review answers. Same shape as the account
// messages (plain text with an HTML twin, every user-chosen word escaped, no tracking).
import { compose, type MailContent } from './templates';

/** A quotation of what was written, short enough for a notice and never HTML. */
export function excerpt(text: string, max = 280): string {
	const flat = text.replace(/\s+/g, ' ').trim();
	return flat.length > max ? `${flat.slice(0, max - 1)}…` : flat;
}

export function mentionMail({ authorName, sheetName, text, url }: { authorName: string; sheetName: string; text: string; url: string }): MailContent {
	return compose({
		subject: `${authorName} mentioned you on “${sheetName}”`,
		paragraphs: [`${authorName} mentioned you in a comment on the sheet “${sheetName}”:`, `“${excerpt(text)}”`],
		action: { label: 'Open the comment', url },
		after: ['You get this because someone wrote your name with @ in a comment.']
	});
}

export function reviewRequestMail(input: { requesterName: string; sheetName: string; revision: number; message: string; dueOn: string | null; url: string }): MailContent {
	return compose({
		subject: `${input.requesterName} asks you to review “${input.sheetName}”`,
		paragraphs: [
			`${input.requesterName} asks you to review revision ${input.revision} of the sheet “${input.sheetName}”${input.dueOn ? `, by ${input.dueOn}` : ''}.`,
			...(input.message ? [`“${excerpt(input.message, 600)}”`] : []),
			'Open the sheet, comment where something worries you, then sign it off or ask for changes.'
		],
		action: { label: 'Open the sheet for review', url: input.url },
		after: []
	});
}

export function reviewAnswerMail(input: { reviewerName: string; sheetName: string; revision: number; decision: 'approve' | 'changes'; summary: string; url: string }): MailContent {
	const verdict = input.decision === 'approve' ? `signed off revision ${input.revision}` : `asks for changes to revision ${input.revision}`;
	return compose({
		subject: `${input.reviewerName} ${verdict} of “${input.sheetName}”`,
		paragraphs: [`${input.reviewerName} ${verdict} of the sheet “${input.sheetName}”.`, ...(input.summary ? [`“${excerpt(input.summary, 600)}”`] : [])],
		action: { label: 'Open the sheet', url: input.url },
		after: []
	});
}
