import { z } from 'zod';
import { QUANTITIES, UNIT_SYSTEMS } from '../units';

/** The unit systems and quantities of shared/units.ts as schemas, for validating input. */
export const unitSystemSchema = z.enum(UNIT_SYSTEMS);
export const quantitySchema = z.enum(QUANTITIES);
