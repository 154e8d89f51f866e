import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	server: { port: 5173, strictPort: false },
	ssr: { external: ['better-sqlite3', '@node-rs/argon2', 'piscina'] },
	// Timeouts are generous on purpose: they only catch a hang, never judge speed (a test must pass on a busy
	// machine; speed is measured in bench/). expect.poll's own default (1 s) would make every poll in the API and
	// browser tests a wall-clock assertion on real work, so those projects wait up to 30 s.
	test: {
		projects: [
			{
				extends: true,
				test: {
					name: 'unit',
					environment: 'node',
					include: ['tests/unit/**/*.test.ts', 'src/**/*.test.ts'],
					testTimeout: 120_000
				}
			},
			{
				extends: true,
				test: {
					name: 'api',
					environment: 'node',
					include: ['tests/api/**/*.test.ts'],
					globalSetup: ['tests/helpers/server-setup.ts'],
					fileParallelism: false,
					testTimeout: 120_000,
					hookTimeout: 240_000,
					expect: { poll: { timeout: 30_000 } }
				}
			},
			{
				extends: true,
				test: {
					name: 'e2e',
					environment: 'node',
					include: ['tests/e2e/**/*.test.ts'],
					globalSetup: ['tests/helpers/server-setup.ts'],
					fileParallelism: false,
					testTimeout: 300_000,
					hookTimeout: 300_000,
					expect: { poll: { timeout: 30_000 } }
				}
			}
		]
	}
});
