/** The e-mails of plan review, as plain text with an absolute link to the plan. */
import type { Mail } from './messages';

const sign = '\n\n— Windowsill, your group\'s spectrum library and window finder';
const quote = (s: string) => s.split('\n').map((l) => `> ${l}`).join('\n');

/** To the group's leads: a plan waits for review. */
export function planSubmittedMail(p: { title: string; author: string; groupName: string; lamp: string | null; link: string; comment?: string | null }): Mail {
	return {
		subject: `Plan waiting for review: ${p.title}`,
		text: `${p.author} submitted the irradiation plan "${p.title}" in ${p.groupName} for review.${p.lamp ? `\nChosen lamp: ${p.lamp}.` : ''}${p.comment ? `\n\n${quote(p.comment)}` : ''}\n\nReview it (approve, or return it with a comment):\n\n${p.link}\n\nThe author cannot approve their own plan; another lead or an admin does.${sign}`
	};
}

/** To the author: approved or returned. */
export function planReviewedMail(p: { title: string; reviewer: string; verdict: 'approved' | 'returned'; comment: string | null; link: string }): Mail {
	const what = p.verdict === 'approved' ? 'approved' : 'returned for changes';
	return {
		subject: `Plan ${p.verdict === 'approved' ? 'approved' : 'returned'}: ${p.title}`,
		text: `${p.reviewer} ${what} your irradiation plan "${p.title}".${p.comment ? `\n\n${quote(p.comment)}` : ''}\n\n${p.verdict === 'returned' ? 'Reply in the plan\'s thread, change it and submit it again:' : 'The approved numbers are frozen in the plan and its report:'}\n\n${p.link}${sign}`
	};
}

/** A new comment in a plan's thread. */
export function planCommentMail(p: { title: string; author: string; body: string; link: string }): Mail {
	return {
		subject: `New comment on plan: ${p.title}`,
		text: `${p.author} wrote on the irradiation plan "${p.title}":\n\n${quote(p.body)}\n\nReply here:\n\n${p.link}${sign}`
	};
}
