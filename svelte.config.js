import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	compilerOptions: { runes: true },
	kit: {
		// BUILD_DIR lets two builds run side by side (e.g. a test run while developing).
		adapter: adapter({ out: process.env.BUILD_DIR || 'build', precompress: false }),
		outDir: process.env.BUILD_DIR ? `${process.env.BUILD_DIR}-kit` : '.svelte-kit',
		// The origin check lives in hooks.server.ts: it must let Bearer-token API clients post
		// forms and multipart without an Origin header, and keep it for cookie sessions.
		csrf: { trustedOrigins: ['*'] },
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self', 'data:'],
				'worker-src': ['self', 'blob:'],
				'connect-src': ['self'],
				'frame-ancestors': ['none'],
				'form-action': ['self'],
				'base-uri': ['self'],
				'object-src': ['none']
			}
		}
	}
};

export default config;
