import type { Agent } from 'supertest';
import type { createApp } from '../../server/app.js';
import type { SettableClock } from '../../server/clock.js';
import { peopleSuite } from './people.js';
import { registerSuite } from './register.js';

export interface BenchCase {
  name: string;
  scale: string;
  target?: string;
  runs?: number;
  run: () => Promise<unknown>;
}

/** `url` is the app's login; `analyze` refreshes statistics as the owner after a bulk load. */
export type BenchContext = ReturnType<typeof createApp> & { clock: SettableClock; url: string; http: Agent; analyze: () => Promise<void> };
export type BenchSuite = (ctx: BenchContext) => Promise<BenchCase[]>;

/** Each feature adds its suite here; suites run in order on one database and may build on earlier data. */
export const BENCH_SUITES: BenchSuite[] = [peopleSuite, registerSuite];
