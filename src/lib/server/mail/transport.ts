/**
 * The nodemailer transport. With SMTP_HOST set it uses SMTP_HOST / SMTP_PORT / SMTP_USER /
 * SMTP_PASSWORD (production); otherwise it talks to the local fake SMTP server on
 * 127.0.0.1:SMTP_PORT (default 2525) without TLS (development and tests).
 */
import nodemailer, { type Transporter } from 'nodemailer';

let transporter: Transporter | null = null;

/** The shared transporter (created on first use). */
export function mailTransport(): Transporter {
	if (transporter) return transporter;
	const env = process.env;
	const port = Number(env.SMTP_PORT ?? 2525);
	transporter = env.SMTP_HOST
		? nodemailer.createTransport({
				host: env.SMTP_HOST,
				port,
				secure: port === 465,
				auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? '' } : undefined
			})
		: nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
	return transporter;
}

/** The From address (SMTP_FROM, default "Windowsill <no-reply@windowsill.test>"). */
export const mailFrom = () => process.env.SMTP_FROM ?? 'Windowsill <no-reply@windowsill.test>';

/** Closes the transport's pooled connections (shutdown). */
export function closeMailTransport(): void {
	transporter?.close();
	transporter = null;
}
