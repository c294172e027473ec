import tailwindcss from '@tailwindcss/vite';
import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	test: {
		projects: [
			{
				extends: './vite.config.ts',
				test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' }
			},
			{
				extends: './vite.config.ts',
				test: {
					name: 'integration',
					include: ['tests/integration/**/*.test.ts'],
					environment: 'node',
					testTimeout: 120_000,
					hookTimeout: 120_000,
					fileParallelism: false
				}
			},
			{
				extends: './vite.config.ts',
				test: {
					name: 'app',
					include: ['tests/app/**/*.test.ts'],
					environment: 'node',
					testTimeout: 120_000,
					hookTimeout: 240_000,
					fileParallelism: false,
					globalSetup: ['tests/e2e/global-setup.ts'],
					setupFiles: ['tests/app/unhandled.ts']
				}
			},
			{
				extends: './vite.config.ts',
				test: {
					name: 'e2e',
					include: ['tests/e2e/**/*.e2e.ts'],
					environment: 'node',
					testTimeout: 120_000,
					hookTimeout: 240_000,
					fileParallelism: false,
					globalSetup: ['tests/e2e/global-setup.ts'],
					setupFiles: ['tests/app/unhandled.ts']
				}
			}
		]
	}
});
