import { db } from './index';

/** True when MariaDB answers `SELECT 1` within `timeoutMs` (default 2000 ms). */
export async function pingDatabase(timeoutMs = 2000): Promise<boolean> {
	let timer: ReturnType<typeof setTimeout> | undefined;
	try {
		const timeout = new Promise<never>((_, reject) => {
			timer = setTimeout(() => reject(new Error('ping timeout')), timeoutMs);
		});
		await Promise.race([db().raw('SELECT 1'), timeout]);
		return true;
	} catch {
		return false;
	} finally {
		clearTimeout(timer);
	}
}
