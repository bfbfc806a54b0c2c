import { db } from './index';

/**
 * True when MariaDB answers `SELECT 1` within `timeoutMs` of database time (default 2000 ms).
 *
 * Measures the database, not the event loop: when the process was busy and the timer fires late,
 * the time the loop was blocked is not counted against the database (the timer is re-armed for
 * what is left, once per late firing, at most 5 times).
 */
export async function pingDatabase(timeoutMs = 2000): Promise<boolean> {
	let timer: ReturnType<typeof setTimeout> | undefined;
	try {
		const query = db().raw('SELECT 1');
		const timeout = new Promise<never>((_, reject) => {
			let budget = timeoutMs;
			let rounds = 0;
			const arm = () => {
				const armedAt = Date.now();
				timer = setTimeout(() => {
					const late = Date.now() - armedAt - budget;
					if (late > 100 && rounds++ < 5) {
						// The loop was blocked for `late` ms: give the database back that time.
						budget = Math.min(late, timeoutMs);
						arm();
					} else reject(new Error('ping timeout'));
				}, budget);
			};
			arm();
		});
		await Promise.race([query, timeout]);
		return true;
	} catch {
		return false;
	} finally {
		clearTimeout(timer);
	}
}
