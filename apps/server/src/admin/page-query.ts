import { z } from 'zod';

/** `?page&pageSize` of the admin lists (pages count from 1). */
export const pageQuerySchema = z.strictObject({
  page: z.coerce.number({ error: 'page must be a number' }).int('page must be a whole number').min(1, 'page must be at least 1').default(1),
  pageSize: z.coerce.number({ error: 'pageSize must be a number' }).int('pageSize must be a whole number').min(1, 'pageSize must be at least 1').max(200, 'pageSize must be at most 200').default(50),
});
