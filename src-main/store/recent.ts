// The recent-projects list, kept in `<user data>/recent-projects.json`: at most ten plans, most
// recently opened or saved first. A plan that has since been moved or deleted stays on the list,
// flagged as missing, until the user removes it: it may be on a drive that is not plugged in.
import { mkdir, readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';
import { writeFileAtomic } from './atomic-write';
import { oneAtATime } from './one-at-a-time';
import { done, errnoOf, fileFailure } from './store-error';
import type { StoreResult } from './store-error';

export const MAX_RECENT = 10;
const RECENT_FORMAT = 'plumbline-recent';

const entrySchema = z.object({ path: z.string().min(1), name: z.string(), openedAt: z.string() });
const fileSchema = z.object({ format: z.literal(RECENT_FORMAT), version: z.literal(1), entries: z.array(entrySchema) });
type StoredEntry = z.infer<typeof entrySchema>;

export interface RecentProject {
  readonly path: string;
  /** The plan's name when it was last opened or saved. */
  readonly name: string;
  readonly openedAt: string;
  /** The file is not there now (moved, deleted, or on a drive that is not connected). */
  readonly missing: boolean;
}

export interface RecentList {
  readonly entries: readonly RecentProject[];
  /** Set when the stored list was damaged and has been set aside (it is rewritten on the next change). */
  readonly problem: string | null;
}

function recentPath(userDataDir: string): string {
  return path.join(userDataDir, 'recent-projects.json');
}

const listKey = (userDataDir: string): string => `recent:${path.resolve(userDataDir)}`;

/** Paths compare without case on Windows and macOS, whose usual file systems ignore it. */
const samePath = (a: string, b: string): boolean =>
  process.platform === 'win32' || process.platform === 'darwin' ? a.toLowerCase() === b.toLowerCase() : a === b;

async function load(userDataDir: string): Promise<StoreResult<{ entries: StoredEntry[]; problem: string | null }>> {
  const file = recentPath(userDataDir);
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (e) {
    if (errnoOf(e) === 'ENOENT') return done({ entries: [], problem: null });
    return fileFailure(e, 'read the recent-projects list', file);
  }
  try {
    const parsed = fileSchema.safeParse(JSON.parse(text));
    if (parsed.success) return done({ entries: parsed.data.entries.slice(0, MAX_RECENT), problem: null });
  } catch {
    // fall through: damaged
  }
  return done({ entries: [], problem: `The recent-projects list "${file}" was damaged and has been set aside.` });
}

async function store(userDataDir: string, entries: readonly StoredEntry[]): Promise<StoreResult<void>> {
  try {
    await mkdir(userDataDir, { recursive: true });
  } catch (e) {
    return fileFailure(e, 'create the user-data folder', userDataDir);
  }
  const text = `${JSON.stringify({ format: RECENT_FORMAT, version: 1, entries }, null, 2)}\n`;
  const written = await writeFileAtomic(recentPath(userDataDir), text, { action: 'save the recent-projects list to' });
  return written.ok ? done(undefined) : written;
}

async function withMissingFlags(entries: readonly StoredEntry[]): Promise<RecentProject[]> {
  return Promise.all(
    entries.map(async (entry) => ({
      ...entry,
      missing: await stat(entry.path).then(
        (info) => !info.isFile(),
        () => true,
      ),
    })),
  );
}

/** The list, most recent first, each entry flagged when its file is missing. */
export async function readRecent(userDataDir: string): Promise<StoreResult<RecentList>> {
  const loaded = await oneAtATime(listKey(userDataDir), () => load(userDataDir));
  if (!loaded.ok) return loaded;
  return done({ entries: await withMissingFlags(loaded.value.entries), problem: loaded.value.problem });
}

/** Read, change and write the list as one step, so two changes in this process cannot interleave. */
function update(userDataDir: string, change: (entries: StoredEntry[]) => StoredEntry[]): Promise<StoreResult<RecentList>> {
  return oneAtATime(listKey(userDataDir), async () => {
    const loaded = await load(userDataDir);
    if (!loaded.ok) return loaded;
    const next = change(loaded.value.entries).slice(0, MAX_RECENT);
    const stored = await store(userDataDir, next);
    if (!stored.ok) return stored;
    return done({ entries: await withMissingFlags(next), problem: loaded.value.problem });
  });
}

/** Puts a plan at the top of the list (moving it if already there), keeping at most ten. */
export function addRecent(
  userDataDir: string,
  entry: { readonly path: string; readonly name: string },
  now: Date = new Date(),
): Promise<StoreResult<RecentList>> {
  const file = path.resolve(entry.path);
  return update(userDataDir, (entries) => [
    { path: file, name: entry.name, openedAt: now.toISOString() },
    ...entries.filter((e) => !samePath(e.path, file)),
  ]);
}

/** Takes one plan off the list (the user's choice, e.g. for a missing file). */
export function removeRecent(userDataDir: string, planPath: string): Promise<StoreResult<RecentList>> {
  const file = path.resolve(planPath);
  return update(userDataDir, (entries) => entries.filter((e) => !samePath(e.path, file)));
}

export function clearRecent(userDataDir: string): Promise<StoreResult<RecentList>> {
  return update(userDataDir, () => []);
}
