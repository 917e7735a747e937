import type { Executor } from '../db/client.js';
import { attemptLine, readingsOf } from '../practicals/attempts.present.js';

/** Every reading of each practical taken by the moment, failed ones and those taken again included, one line each. */
export async function readingsThen(db: Executor, practicalIds: string[], at: Date, when: (iso: string) => string): Promise<Map<string, string[]>> {
  const byPractical = await readingsOf(db, practicalIds, at);
  return new Map([...byPractical].map(([id, list]) => [id, list.map((a) => `${a.prompt}: ${attemptLine(a, when)}`)]));
}
