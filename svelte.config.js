import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		// BUILD_DIR lets parallel work build into its own folder (default: build).
		// precompress: .br and .gz copies of the static assets, served by adapter-node when the client accepts them.
		adapter: adapter({ out: process.env.BUILD_DIR ?? 'build', precompress: true }),
		// CSRF: our own guard in src/lib/server/csrf.ts (bearer-token scripts may POST files without an Origin).
		csrf: { trustedOrigins: ['*'] },
		// A strict CSP the app itself passes: SvelteKit hashes its own inline bootstrap script.
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
				'connect-src': ['self'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none']
			}
		}
	}
};

export default config;
