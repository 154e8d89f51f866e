// The shipped systemd units (ops/): what README › Operations promises of them, and systemd's own check when
// systemd-analyze is on the machine.
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

/** `Key=value` lines of a unit file by section; a key may repeat (Environment=). */
function parseUnit(text: string): Record<string, [string, string][]> {
	const sections: Record<string, [string, string][]> = {};
	let current = '';
	for (const raw of text.split('\n')) {
		const line = raw.trim();
		if (!line || line.startsWith('#')) continue;
		const head = /^\[(.+)\]$/.exec(line);
		if (head) sections[(current = head[1]!)] = [];
		else {
			const at = line.indexOf('=');
			sections[current]!.push([line.slice(0, at), line.slice(at + 1)]);
		}
	}
	return sections;
}
const values = (s: [string, string][], key: string) => s.filter(([k]) => k === key).map(([, v]) => v);

const service = parseUnit(readFileSync('ops/bulkpad.service', 'utf8'));
const svc = service.Service!;

describe('ops/bulkpad.service', () => {
	it('restarts the built server whatever way it stopped, as its own user, from the app folder', () => {
		expect(values(svc, 'Restart')).toEqual(['always']);
		expect(values(svc, 'ExecStart')).toEqual(['/usr/bin/node build/index.js']);
		expect(values(svc, 'User')).toEqual(['bulkpad']);
		expect(values(svc, 'WorkingDirectory')).toEqual(['/opt/bulkpad']);
		expect(values(service.Unit!, 'StartLimitIntervalSec')).toEqual(['0']);
		expect(values(service.Install!, 'WantedBy')).toEqual(['multi-user.target']);
	});

	it('is hardened and may write only its state folder', () => {
		for (const [key, value] of [
			['NoNewPrivileges', 'yes'],
			['ProtectSystem', 'strict'],
			['ProtectHome', 'yes'],
			['PrivateTmp', 'yes'],
			['PrivateDevices', 'yes'],
			['CapabilityBoundingSet', ''],
			['ReadWritePaths', '/var/lib/bulkpad']
		]) {
			expect(values(svc, key!), key).toEqual([value]);
		}
		const env = Object.fromEntries(values(svc, 'Environment').map((e) => e.replace(/^"|"$/g, '').split(/=(.*)/s).slice(0, 2)));
		expect(env.DATABASE_URL!.startsWith('/var/lib/bulkpad/')).toBe(true);
		expect(env.NODE_ENV).toBe('production');
	});

	it('sets only variables the server reads or adapter-node documents (a misspelt one would be ignored)', () => {
		const read = readFileSync('src/lib/server/env.ts', 'utf8') + readFileSync('src/lib/server/db/index.ts', 'utf8');
		const adapterNode = ['HOST', 'PORT', 'ORIGIN', 'BODY_SIZE_LIMIT', 'NODE_ENV', 'ADDRESS_HEADER', 'XFF_DEPTH'];
		const names = values(svc, 'Environment').map((e) => e.replace(/^"/, '').split('=')[0]!);
		expect(names.length).toBeGreaterThan(8);
		for (const name of names) {
			const used = adapterNode.includes(name) || read.includes(`process.env.${name}`) || read.includes(`'${name}'`);
			expect(used, `${name} is read nowhere in src/lib/server/env.ts`).toBe(true);
		}
	});

	// reported as skipped, not passed, on a machine without systemd
	it.skipIf(spawnSync('systemd-analyze', ['--version']).status !== 0)('passes systemd-analyze verify', () => {
		for (const unit of ['ops/bulkpad.service', 'ops/bulkpad-backup.service', 'ops/bulkpad-backup.timer', 'ops/bulkpad-redis.service']) {
			const r = spawnSync('systemd-analyze', ['verify', '--man=no', unit], { encoding: 'utf8' });
			expect(r.stderr + r.stdout, unit).toBe('');
			expect(r.status, unit).toBe(0);
		}
		const exposure = execFileSync('systemd-analyze', ['security', '--offline=yes', 'ops/bulkpad.service'], { encoding: 'utf8' });
		expect(Number(/Overall exposure level for bulkpad\.service: ([\d.]+)/.exec(exposure)?.[1])).toBeLessThan(3);
	});
});

// the fleet's units (README › Operations › Several machines): a template for the workers and Redis beside the server
describe('ops/bulkpad-worker@.service and ops/bulkpad-redis.service', () => {
	const worker = parseUnit(readFileSync('ops/bulkpad-worker@.service', 'utf8'));
	const redis = parseUnit(readFileSync('ops/bulkpad-redis.service', 'utf8'));

	it('runs the bundled worker, restarted always, as the service user, without write access anywhere', () => {
		const w = worker.Service!;
		expect(values(w, 'ExecStart')).toEqual(['/usr/bin/node dist/fleet-worker.mjs']);
		expect(values(w, 'Restart')).toEqual(['always']);
		expect(values(w, 'User')).toEqual(['bulkpad']);
		expect(values(w, 'ReadWritePaths')).toEqual([]);
		expect(values(w, 'StateDirectory')).toEqual([]);
		const env = values(w, 'Environment').map((e) => e.split('=')[0]);
		expect(env).toContain('BULKPAD_QUEUE');
		expect(values(w, 'Environment')).not.toContainEqual(expect.stringMatching(/^DATABASE_URL=/));
	});

	it('points the workers at the Redis instance of the redis unit', () => {
		const port = /--port (\d+)/.exec(values(redis.Service!, 'ExecStart')[0]!)?.[1];
		expect(values(worker.Service!, 'Environment')).toContain(`BULKPAD_QUEUE=redis://127.0.0.1:${port}`);
		expect(values(redis.Service!, 'Restart')).toEqual(['always']);
	});

	it.skipIf(spawnSync('systemd-analyze', ['--version']).status !== 0)('are verified and as hardened as the server', () => {
		// a template is verified as one of its instances
		const dir = mkdtempSync(join(tmpdir(), 'bulkpad-units-'));
		const instance = join(dir, 'bulkpad-worker@1.service');
		copyFileSync('ops/bulkpad-worker@.service', instance);
		const r = spawnSync('systemd-analyze', ['verify', '--man=no', instance], { encoding: 'utf8' });
		expect(r.stderr + r.stdout).toBe('');
		for (const [unit, name] of [
			[instance, 'bulkpad-worker@1.service'],
			['ops/bulkpad-redis.service', 'bulkpad-redis.service']
		] as const) {
			const exposure = execFileSync('systemd-analyze', ['security', '--offline=yes', unit], { encoding: 'utf8' });
			const level = Number(new RegExp(`Overall exposure level for ${name.replace(/[.@]/g, '\\$&')}: ([\\d.]+)`).exec(exposure)?.[1]);
			expect(level, name).toBeLessThan(3);
		}
		rmSync(dir, { recursive: true, force: true });
	});
});
