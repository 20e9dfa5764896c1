/** Small helpers shared by the route modules. */
import type { ZodType } from 'zod';

/** A positive integer path parameter, or NaN (services answer 404 for NaN). */
export function intParam(value: string | string[] | undefined): number {
  const v = Array.isArray(value) ? value[0] : value;
  return v !== undefined && /^[1-9][0-9]{0,9}$/.test(v) ? Number(v) : Number.NaN;
}

/** Parses with a zod schema; a ZodError becomes a 400 in the error handler. */
export function parseBody<T>(schema: ZodType<T>, body: unknown): T {
  return schema.parse(body ?? {});
}
