// See https://svelte.dev/docs/kit/types#app.d.ts
import type { SessionUser, SessionInfo } from '$lib/server/auth/types';

declare global {
	namespace App {
		interface Error {
			code?: string;
		}
		interface Locals {
			user: SessionUser | null;
			session: SessionInfo | null;
			/** Set by handleError when the failure was a database outage (answered 503 by outageGuard). */
			dbOutage?: boolean;
		}
	}
}

export {};
