/**
 * The e-mails Windowsill sends, as plain text. Each returns `{ subject, text }`; links are
 * absolute (built from PUBLIC_ORIGIN or the request origin by the caller).
 */
export interface Mail {
	subject: string;
	text: string;
}

const sign = '\n\n— Windowsill, your group\'s spectrum library and window finder';

/** Link to confirm an e-mail address after sign-up. */
export function verifyEmailMail(name: string, link: string): Mail {
	return {
		subject: 'Confirm your e-mail address for Windowsill',
		text: `Hello ${name},\n\nopen this link to confirm your address (valid for 48 hours):\n\n${link}\n\nIf you did not create an account, ignore this message.${sign}`
	};
}

/** Someone tried to sign up with an address that already has an account. */
export function alreadyRegisteredMail(link: string): Mail {
	return {
		subject: 'Your Windowsill account',
		text: `Someone (perhaps you) tried to create a Windowsill account with this address, which already has one.\nForgot the password? Choose a new one here:\n\n${link}${sign}`
	};
}

/** Single-use password reset link (1 hour). */
export function passwordResetMail(link: string): Mail {
	return {
		subject: 'Choose a new Windowsill password',
		text: `Open this link within one hour to choose a new password. It works once.\n\n${link}\n\nIf you did not ask for this, ignore this message; your password stays as it is.${sign}`
	};
}

/** Invitation to a group. */
export function invitationMail(groupName: string, inviter: string, role: string, link: string): Mail {
	return {
		subject: `Invitation to ${groupName} on Windowsill`,
		text: `${inviter} invites you to join "${groupName}" as ${role}.\nAccept within 7 days (the link works once):\n\n${link}${sign}`
	};
}

/** Notice that a member's role changed. */
export function roleChangedMail(groupName: string, from: string, to: string, link: string): Mail {
	return {
		subject: `Your role in ${groupName} is now ${to}`,
		text: `Your role in "${groupName}" changed from ${from} to ${to}.\n\n${link}${sign}`
	};
}
