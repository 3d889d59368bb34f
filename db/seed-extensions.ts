import type { DemoIds } from './seed';
import type { Db } from './client';
import { seedRecords } from './seed-records';
import { seedSensors } from './seed-sensors';

export type SeedTx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** A feature's part of the demo: it adds its invented records after the sites, people and hives exist. */
export type SeedExtension = (tx: SeedTx, ids: DemoIds, now: Date) => Promise<void>;

/** Each feature adds its own entry here (records, sensor logs, invitations…), in dependency order. */
export const seedExtensions: SeedExtension[] = [seedRecords, seedSensors];
