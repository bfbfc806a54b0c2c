/**
 * Helpers for page loads and form actions: the policy module throws `ApiError`s (JSON world);
 * pages need a redirect to sign-in for 401 and SvelteKit's `error()` for 403/404.
 */
import { error, isHttpError, isRedirect, redirect, type RequestEvent } from '@sveltejs/kit';
import { ApiError } from '../http';
import type { SessionUser } from './types';

/** The signed-in user, or a 303 to /signin that comes back to this page afterwards. */
export function pageUser(event: Pick<RequestEvent, 'locals' | 'url'>): SessionUser {
	if (!event.locals.user) redirect(303, `/signin?next=${encodeURIComponent(event.url.pathname + event.url.search)}`);
	return event.locals.user;
}

/** Runs a policy or service call and turns its `ApiError` into the page equivalent. */
export async function asPage<T>(event: Pick<RequestEvent, 'url'>, fn: () => Promise<T> | T): Promise<T> {
	try {
		return await fn();
	} catch (e) {
		if (isRedirect(e) || isHttpError(e)) throw e;
		if (e instanceof ApiError) {
			if (e.status === 401) redirect(303, `/signin?next=${encodeURIComponent(event.url.pathname)}`);
			error(e.status, { message: e.message, code: e.code });
		}
		throw e;
	}
}

/** The client address as adapter-node sees it (headers are trusted only when ADDRESS_HEADER is configured). */
export function clientIp(event: Pick<RequestEvent, 'getClientAddress'>): string {
	try {
		return event.getClientAddress();
	} catch {
		return 'unknown';
	}
}
