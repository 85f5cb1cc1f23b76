import type { MigrationInterface } from 'typeorm';
import { Initial1796172961355 } from './migrations/1796172961355-Initial';

/** Every migration, in order, as a class array. Add new ones at the end. */
export const migrations: (new () => MigrationInterface)[] = [Initial1796172961355];
