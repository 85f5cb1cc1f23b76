import { z } from 'zod';

/** ISO calendar date, YYYY-MM-DD, that really exists. */
export const isoDateSchema = z.iso.date('Use a date like 2027-05-14.');

/** ISO 8601 date-time with offset or Z. */
export const isoDateTimeSchema = z.iso.datetime({ offset: true, message: 'Use a date and time like 2027-05-14T07:30:00Z.' });

export const uuidSchema = z.uuid('Not a valid id.');

export const paginationQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});

export const pageMetaSchema = z.object({ total: z.number(), page: z.number(), pageSize: z.number() });
export type PageMeta = z.infer<typeof pageMetaSchema>;

/** An optional idempotency key sent by offline-capable clients; a retry with the same key returns the first record. */
export const idempotencyKeySchema = z.string().trim().min(8).max(64).regex(/^[A-Za-z0-9_-]+$/, 'Idempotency keys use letters, digits, - and _.');

export const optionalText = (max: number) => z.string().trim().max(max).default('');

type WithoutDefaults<T extends z.ZodRawShape> = { [K in keyof T]: T[K] extends z.ZodDefault<infer Inner> ? Inner : T[K] };

/**
 * The PATCH form of a create schema: every field optional and no defaults filled in, so a
 * partial update changes only the fields it names (zod's .partial() alone would still apply
 * defaults and silently reset the fields left out).
 */
export function patchSchemaOf<T extends z.ZodRawShape>(schema: z.ZodObject<T>) {
  const shape: Record<string, z.ZodType> = {};
  for (const [k, v] of Object.entries(schema.shape)) shape[k] = v instanceof z.ZodDefault ? (v.unwrap() as z.ZodType) : (v as z.ZodType);
  return z.object(shape as unknown as WithoutDefaults<T>).partial();
}
