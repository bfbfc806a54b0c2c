import { defineConfig } from '@playwright/test';

/**
 * End-to-end tests against the production build (`node build`) in Debian's Chromium.
 * Never downloads a browser. When E2E_BASE_URL is set, no server is started here.
 */
const port = Number(process.env.E2E_PORT ?? 4173);
const external = process.env.E2E_BASE_URL;
const baseURL = external ?? `http://127.0.0.1:${port}`;
// npm test builds into its own folder (BUILD_DIR, default .build-test there) so a running `npm start` keeps its build/.
const buildDir = process.env.BUILD_DIR ?? 'build';

export default defineConfig({
	testDir: 'tests/e2e',
	testMatch: /.*\.e2e\.ts$/,
	outputDir: 'test-results/artifacts',
	fullyParallel: false,
	workers: 1,
	retries: 0,
	timeout: 60_000,
	expect: { timeout: 10_000 },
	reporter: [['list']],
	use: {
		baseURL,
		screenshot: 'only-on-failure',
		trace: 'off',
		launchOptions: {
			executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
			args: [
				'--headless',
				'--no-sandbox',
				'--disable-gpu',
				'--disable-quic',
				'--no-first-run',
				'--disable-background-networking',
				'--disable-component-update',
				'--disable-sync',
				'--disable-dev-shm-usage'
			]
		}
	},
	webServer: external
		? undefined
		: {
				command: `node ${buildDir}`,
				url: `${baseURL}/api/health`,
				reuseExistingServer: false,
				timeout: 60_000,
				stdout: 'ignore',
				stderr: 'pipe',
				env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), BODY_SIZE_LIMIT: process.env.BODY_SIZE_LIMIT ?? '25M' } as Record<string, string>
			}
});
