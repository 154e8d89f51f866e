import { HoloError } from '../errors';
import type { Bulk, BulkName } from '../types';
import { makeBoosted } from './boosted';
import { makeBrane } from './brane';
import { makeCharged } from './charged';
import { makeDpBulk } from './dp';
import { makeSolitonBulk } from './soliton';
import { makeMetric } from './metric';
import { makeVacuum } from './vacuum';
import { makeVaidya } from './vaidya';
import { makeWave } from './wave';

type Factory = (params: Record<string, number | string>) => Bulk;

const factories = new Map<string, Factory>([
	['vacuum', makeVacuum],
	['brane', makeBrane],
	['boosted', makeBoosted],
	['wave', makeWave],
	['charged', makeCharged],
	['metric', makeMetric],
	['soliton', makeSolitonBulk],
	['dp', makeDpBulk],
	['vaidya', makeVaidya]
]);

export const BULK_NAMES: readonly BulkName[] = ['vacuum', 'brane', 'boosted', 'wave', 'charged', 'soliton', 'dp', 'metric', 'vaidya'];

/**
 * Adds a bulk kind defined outside this folder (soliton, dp): its factory returns a `Bulk` whose `slice`
 * follows the `Slice` convention, and every strip, entropy and energy routine then works on it.
 */
export function registerBulk(name: BulkName, factory: Factory): void {
	factories.set(name, factory);
}

/** Builds a validated bulk; throws HoloError (with the offending key) on any bad input. */
export function makeBulk(name: string, params: Record<string, number | string>): Bulk {
	const factory = factories.get(name);
	if (!factory) {
		const known = BULK_NAMES.join(', ');
		throw new HoloError(`unknown bulk '${name}'`, 'bulk', `bulks: ${known}`);
	}
	if (params === null || typeof params !== 'object') throw new HoloError('bulk parameters missing', 'bulk');
	return factory(params);
}
