import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	ssr: {
		// Native binding: keep it out of the server bundle.
		external: ['@node-rs/argon2']
	},
	test: {
		include: ['src/**/*.test.ts', 'tests/integration/**/*.test.ts'],
		environment: 'node',
		// Integration tests share one real MariaDB test database: run files one after another.
		fileParallelism: false,
		testTimeout: 30_000,
		// The source-tree parser process starts through tsx (seconds on a busy machine); the built app's starts at once.
		env: { PARSE_TIMEOUT_MS: process.env.PARSE_TIMEOUT_MS ?? '120000' },
		hookTimeout: 60_000
	}
});
