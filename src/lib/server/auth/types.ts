/** The user fields the server keeps on `locals` for a signed-in request. */
export interface SessionUser {
	id: string;
	email: string;
	name: string;
	siteRole: 'admin' | 'user';
	emailVerified: boolean;
}

/** The session behind a request: a cookie session or an API token. */
export interface SessionInfo {
	id: string;
	expiresAt: Date;
	via: 'cookie' | 'token';
}
