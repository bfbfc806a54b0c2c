/**
 * Second build step of `npm run build`: the upload-parsing worker thread as one server-side
 * module, `<BUILD_DIR>/workers/parse.js` (src/lib/server/parse/pool.ts finds it beside the build).
 * Dependencies stay external (node_modules is installed wherever the app runs).
 */
import { defineConfig } from 'vite';
import { fileURLToPath } from 'node:url';

const out = process.env.BUILD_DIR ?? 'build';

export default defineConfig({
	resolve: { alias: { $lib: fileURLToPath(new URL('../src/lib', import.meta.url)) } },
	build: {
		ssr: 'src/lib/server/parse/parseWorker.ts',
		outDir: `${out}/workers`,
		emptyOutDir: true,
		target: 'node20',
		minify: false,
		sourcemap: false,
		rollupOptions: { output: { format: 'es', entryFileNames: 'parse.js' } }
	}
});
