import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	server: { port: 5173, strictPort: false },
	ssr: { external: ['better-sqlite3', '@node-rs/argon2', 'piscina'] },
	test: {
		projects: [
			{
				extends: true,
				test: {
					name: 'unit',
					environment: 'node',
					include: ['tests/unit/**/*.test.ts', 'src/**/*.test.ts']
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
					testTimeout: 30_000,
					hookTimeout: 240_000
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
					testTimeout: 60_000,
					hookTimeout: 300_000
				}
			}
		]
	}
});
