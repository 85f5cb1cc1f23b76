import type { MigrationInterface } from 'typeorm';
import { Initial1796172961355 } from './migrations/1796172961355-Initial';
import { Notebook1796173447622 } from './migrations/1796173447622-Notebook';
import { CohortExclusions1796174483450 } from './migrations/1796174483450-CohortExclusions';
import { Notifications1796175730534 } from './migrations/1796175730534-Notifications';
import { CohortLogRollups1796186007321 } from './migrations/1796186007321-CohortLogRollups';
import { NaturalLabelOrder1796197728392 } from './migrations/1796197728392-NaturalLabelOrder';
import { GardenTimeZone1796211355813 } from './migrations/1796211355813-GardenTimeZone';

/** Every migration, in order, as a class array. Add new ones at the end. */
export const migrations: (new () => MigrationInterface)[] = [Initial1796172961355, Notebook1796173447622, CohortExclusions1796174483450, Notifications1796175730534, CohortLogRollups1796186007321, NaturalLabelOrder1796197728392, GardenTimeZone1796211355813];
