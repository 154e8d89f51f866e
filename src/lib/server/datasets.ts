/**
 * Datasets: a member's own numbers (a CSV) kept per owner under a name the console can use,
 * `compare <name> …`. Only the owner ever sees one; any other id is the same 404.
 */
import { and, desc, eq, sql, sum } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, openDb, schema } from './db';
import { newId } from './auth/accounts';
import type { AppUser } from './auth/guards';
import { failure } from './http';
import { env } from './env';
import { CsvProblem, parseNumericCsv } from './csv';
import { DATASET_NAME, DATASET_NAME_MAX, formatBytes, nameFromFile } from '../library/format';

export const DATASETS_PER_OWNER = 50;

function bytesFrom(name: string, fallback: number): number {
	const n = Number(process.env[name]);
	return Number.isFinite(n) && n > 0 ? n : fallback;
}
/** Stored bytes (as uploaded) one member may keep, and the whole group together (this server is one group). */
export const DATASET_QUOTA = {
	perUser: bytesFrom('BULKPAD_DATASET_BYTES_PER_USER', 20_000_000),
	perGroup: bytesFrom('BULKPAD_DATASET_BYTES_PER_GROUP', 500_000_000)
};

export const datasetNameSchema = z
	.string()
	.trim()
	.max(DATASET_NAME_MAX, `A dataset name has at most ${DATASET_NAME_MAX} characters.`)
	.regex(DATASET_NAME, "A dataset name is lower-case letters, digits and '_', starting with a letter (e.g. lattice_d4).");

/** Browsers and operating systems label CSV files differently; anything else is not a CSV. */
const CSV_TYPES = new Set([
	'',
	'text/csv',
	'application/csv',
	'text/comma-separated-values',
	'application/vnd.ms-excel',
	'text/plain',
	'application/octet-stream'
]);

type DatasetRow = typeof schema.datasets.$inferSelect;

function summary(d: Pick<DatasetRow, 'id' | 'name' | 'columns' | 'rows' | 'bytes' | 'createdAt'> & { origin?: string | null }) {
	return {
		id: d.id,
		name: d.name,
		columns: d.columns as string[],
		rows: (d.rows as number[][]).length,
		bytes: d.bytes,
		createdAt: d.createdAt,
		/** where a fork's copy came from (the original dataset and its owner); null for an upload */
		origin: d.origin ?? null
	};
}
export type DatasetSummary = ReturnType<typeof summary>;

/** The owner's datasets without their rows: SQLite counts them, so listing never parses a megabyte of JSON. */
export function listDatasets(owner: AppUser): DatasetSummary[] {
	const d = schema.datasets;
	return getDb()
		.select({
			id: d.id,
			name: d.name,
			columns: d.columns,
			rows: sql<number>`json_array_length(${d.rows})`,
			bytes: d.bytes,
			createdAt: d.createdAt,
			origin: d.origin
		})
		.from(d)
		.where(eq(d.ownerId, owner.id))
		.orderBy(desc(d.createdAt))
		.all()
		.map((r) => ({ ...r, columns: r.columns as string[] }));
}

function findOwn(owner: AppUser, id: string): DatasetRow {
	const row = getDb()
		.select()
		.from(schema.datasets)
		.where(and(eq(schema.datasets.id, id), eq(schema.datasets.ownerId, owner.id)))
		.get();
	if (!row) failure(404, 'No such dataset.');
	return row;
}

/** The owner's dataset with every row. */
export function getDataset(owner: AppUser, id: string) {
	const row = findOwn(owner, id);
	return { ...summary(row), count: (row.rows as number[][]).length, rows: row.rows as number[][] };
}

export function deleteDataset(owner: AppUser, id: string): void {
	const row = findOwn(owner, id);
	getDb().delete(schema.datasets).where(eq(schema.datasets.id, row.id)).run();
}

/** Type first (cheap), then size, then content: each answers the status a client can act on. */
export async function uploadDataset(owner: AppUser, file: File, requestedName: string | null): Promise<DatasetSummary> {
	if (!/\.csv$/i.test(file.name) || !CSV_TYPES.has(file.type.split(';')[0]!.trim().toLowerCase())) {
		failure(400, `Only CSV files can be uploaded (got ${file.name || 'a file without a name'}${file.type ? `, ${file.type}` : ''}).`);
	}
	if (file.size > env.uploadMaxBytes) {
		failure(413, `The file is ${formatBytes(file.size)}; the limit is ${formatBytes(env.uploadMaxBytes)}.`, { limit: env.uploadMaxBytes });
	}
	const raw = requestedName?.trim() ? requestedName : nameFromFile(file.name);
	const named = datasetNameSchema.safeParse(raw);
	if (!named.success) failure(400, named.error.issues[0]!.message);
	const name = named.data;

	let table;
	try {
		table = parseNumericCsv(new TextDecoder('utf-8', { fatal: false }).decode(await file.arrayBuffer()));
	} catch (e) {
		if (e instanceof CsvProblem) failure(400, e.message, e.where);
		throw e;
	}

	const db = getDb();
	const row = db.transaction((tx) => {
		const mine = tx
			.select({ id: schema.datasets.id, name: schema.datasets.name })
			.from(schema.datasets)
			.where(eq(schema.datasets.ownerId, owner.id))
			.all();
		if (mine.some((d) => d.name === name))
			failure(409, `You have a dataset called '${name}' already: delete it first or give another name.`);
		if (mine.length >= DATASETS_PER_OWNER) failure(409, `You have ${mine.length} datasets; delete one before uploading more.`);
		const usedByMe = storedBytes(tx, owner.id);
		if (usedByMe + file.size > DATASET_QUOTA.perUser) {
			failure(
				413,
				`Your datasets use ${formatBytes(usedByMe)} of your ${formatBytes(DATASET_QUOTA.perUser)}; delete one before uploading ${formatBytes(file.size)} more.`,
				{
					quota: DATASET_QUOTA.perUser,
					used: usedByMe
				}
			);
		}
		const usedByAll = storedBytes(tx);
		if (usedByAll + file.size > DATASET_QUOTA.perGroup) {
			failure(
				413,
				`The group's datasets use ${formatBytes(usedByAll)} of ${formatBytes(DATASET_QUOTA.perGroup)}; ask an admin to make room.`,
				{
					quota: DATASET_QUOTA.perGroup,
					used: usedByAll
				}
			);
		}
		const row = { id: newId(), ownerId: owner.id, name, columns: table.columns, rows: table.rows, bytes: file.size, createdAt: new Date() };
		tx.insert(schema.datasets).values(row).run();
		return row;
	});
	return summary(row);
}

/** Sum of the stored sizes, of one owner or of everyone: counted from the rows already there (no schema change). */
function storedBytes(tx: Pick<ReturnType<typeof getDb>, 'select'>, ownerId?: string): number {
	const q = tx.select({ total: sum(schema.datasets.bytes) }).from(schema.datasets);
	const row = (ownerId ? q.where(eq(schema.datasets.ownerId, ownerId)) : q).get();
	return Number(row?.total ?? 0);
}

/** The owner's datasets by reference: name, id and size, no rows (an evaluation loads rows only by id). */
export function datasetRefs(ownerId: string): { id: string; name: string; bytes: number }[] {
	return getDb()
		.select({ id: schema.datasets.id, name: schema.datasets.name, bytes: schema.datasets.bytes })
		.from(schema.datasets)
		.where(eq(schema.datasets.ownerId, ownerId))
		.all();
}

/**
 * Rows of some of one owner's datasets, for an evaluation process that does not hold them yet. The JSON text
 * is handed over as stored and parsed in that process, so the request thread never parses or clones rows.
 */
export function datasetTexts(ownerId: string, ids: string[]): { id: string; columns: string; rows: string }[] {
	if (!ids.length) return [];
	return openDb()
		.sqlite.prepare('select id, columns, rows from datasets where owner_id = ? and id in (select value from json_each(?))')
		.all(ownerId, JSON.stringify(ids)) as { id: string; columns: string; rows: string }[];
}

// ── paper output (branch paper): forks carry the datasets their steps compare against ──

export interface ForkedDatasets {
	/** names copied into the forker's datasets, each with its origin */
	copied: string[];
	/** names the forker already had: theirs is kept (a replay of the fork uses it) */
	kept: string[];
	/** names not copied because the forker's dataset count or byte quota would be exceeded */
	skipped: string[];
}

/**
 * Copies the datasets of `fromOwnerId` named in `names` to `toOwnerId`, inside the fork's transaction, each
 * named as before (the steps say `compare <name>`) and attributed in `origin` to the original dataset and
 * owner. The copy is the dataset as it is now: a snapshot keeps steps, not the rows they compared against.
 */
export function copyDatasetsForFork(
	tx: Pick<ReturnType<typeof getDb>, 'select' | 'insert'>,
	fromOwnerId: string,
	toOwnerId: string,
	names: Set<string>,
	origin: (name: string) => string
): ForkedDatasets {
	const out: ForkedDatasets = { copied: [], kept: [], skipped: [] };
	if (!names.size || fromOwnerId === toOwnerId) return out;
	const theirs = tx.select().from(schema.datasets).where(eq(schema.datasets.ownerId, fromOwnerId)).all();
	const wanted = theirs.filter((d) => names.has(d.name));
	if (!wanted.length) return out;
	const mine = tx.select({ name: schema.datasets.name }).from(schema.datasets).where(eq(schema.datasets.ownerId, toOwnerId)).all();
	const have = new Set(mine.map((d) => d.name));
	let count = mine.length;
	let bytes = storedBytes(tx, toOwnerId);
	let groupBytes = storedBytes(tx);
	for (const d of wanted) {
		if (have.has(d.name)) {
			out.kept.push(d.name);
			continue;
		}
		if (count + 1 > DATASETS_PER_OWNER || bytes + d.bytes > DATASET_QUOTA.perUser || groupBytes + d.bytes > DATASET_QUOTA.perGroup) {
			out.skipped.push(d.name);
			continue;
		}
		tx.insert(schema.datasets)
			.values({
				id: newId(),
				ownerId: toOwnerId,
				name: d.name,
				columns: d.columns,
				rows: d.rows,
				bytes: d.bytes,
				createdAt: new Date(),
				origin: origin(d.name)
			})
			.run();
		count++;
		bytes += d.bytes;
		groupBytes += d.bytes;
		out.copied.push(d.name);
	}
	return out;
}
