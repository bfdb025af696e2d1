import { z } from 'zod';
/** GET /api/health */
export const healthSchema = z.object({ status: z.enum(['ok', 'degraded']), db: z.enum(['ok', 'down']) });
export type Health = z.infer<typeof healthSchema>;
