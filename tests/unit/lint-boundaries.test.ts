// The layering of DEVELOPERS.md ("Boundaries") as eslint.config.js enforces it: each line is linted as if it
// were a file in the folder named, and must be refused (or allowed) by no-restricted-imports.
import { ESLint } from 'eslint';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
let eslint: ESLint;

beforeAll(() => {
	eslint = new ESLint({ cwd: ROOT });
});

/** The no-restricted-imports messages for one import line placed at `file`. */
async function refusals(file: string, line: string): Promise<string[]> {
	const [result] = await eslint.lintText(`${line}\nexport const used = [x];\n`, { filePath: `${ROOT}/${file}` });
	return result.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message);
}

const refused: [string, string][] = [
	['src/lib/holo/probe.ts', "import { x } from '../lang/parser';"],
	['src/lib/holo/series/probe.ts', "import { x } from '../../lang';"],
	['src/lib/holo/probe.ts', "import { x } from '$lib/server/env';"],
	['src/lib/holo/probe.ts', "import x from '$lib/components/Console.svelte';"],
	['src/lib/holo/probe.ts', "import { x } from 'svelte';"],
	['src/lib/holo/probe.ts', "import { x } from '$app/state';"],
	['src/lib/holo/probe.ts', "import { x } from 'node:fs';"],
	['src/lib/holo/probe.ts', "import { x } from 'path';"],
	['src/lib/lang/probe.ts', "import { x } from '../server/db';"],
	['src/lib/lang/probe.ts', "import x from '$lib/components/StepView.svelte';"],
	['src/lib/lang/probe.ts', "import { x } from '$app/navigation';"],
	['src/lib/components/probe.ts', "import { x } from '$lib/server/pads';"],
	['src/lib/client/probe.ts', "import { x } from '../server/eval/pool';"],
	['src/routes/(app)/pads/+page.ts', "import { x } from './+page.server';"],
	['src/lib/components/probe.ts', "import { x } from '$env/static/private';"],
	['src/lib/library/probe.ts', "import { x } from 'node:crypto';"]
];

const allowed: [string, string][] = [
	['src/lib/holo/probe.ts', "import { x } from './numeric/newton';"],
	['src/lib/holo/bulks/probe.ts', "import { x } from 'mathjs';"],
	['src/lib/lang/probe.ts', "import { x } from '../holo/index';"],
	['src/lib/lang/probe.ts', "import { x } from 'zod';"],
	['src/lib/components/probe.ts', "import { x } from '$lib/lang/parser';"],
	['src/lib/server/probe.ts', "import { x } from 'node:fs';"],
	['src/routes/(app)/pads/+page.server.ts', "import { x } from '$lib/server/pads';"]
];

describe('import boundaries (eslint.config.js)', () => {
	it.each(refused)('%s refuses %s', async (file, line) => {
		expect(await refusals(file, line)).toHaveLength(1);
	});
	it.each(allowed)('%s allows %s', async (file, line) => {
		expect(await refusals(file, line)).toEqual([]);
	});
});
