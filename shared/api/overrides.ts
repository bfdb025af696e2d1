import { z } from 'zod';

/**
 * Engineer's overrides of one member's inputs. Each field set to a value overrides the
 * model; set to null it removes that override. A reason is always required.
 * Units: MPa for fy/fu, mm for hole diameter, N for the design force (tension positive).
 */
export const memberOverrideRequestSchema = z
  .object({
    grade: z.string().trim().min(1).max(60).nullable().optional(),
    fy: z.number().positive().max(2000, 'fy above 2000 MPa is not a structural steel').nullable().optional(),
    fu: z.number().positive().max(2500, 'fu above 2500 MPa is not a structural steel').nullable().optional(),
    kt: z.number().positive().max(1).nullable().optional(),
    U: z.number().positive().max(1).nullable().optional(),
    holeDiameter: z.number().positive().max(200, 'a hole above 200 mm is not a bolt hole').nullable().optional(),
    designForceN: z.number().min(-1e9).max(1e9).nullable().optional(),
    inclusion: z.enum(['auto', 'included', 'excluded']).optional(),
    reason: z.string().trim().min(5, 'Give a reason (at least 5 characters)').max(1000),
  })
  .refine((o) => Object.keys(o).some((k) => k !== 'reason'), { message: 'Nothing to change' })
  .refine((o) => (o.fy == null) === (o.fu == null), { message: 'Give fy and fu together', path: ['fu'] })
  .refine((o) => o.fy == null || o.fu == null || o.fu >= o.fy, { message: 'fu must not be below fy', path: ['fu'] });
export type MemberOverrideRequest = z.infer<typeof memberOverrideRequestSchema>;

export const OVERRIDE_FIELDS = ['grade', 'fy', 'fu', 'kt', 'U', 'holeDiameter', 'designForceN'] as const;
export type OverrideField = (typeof OVERRIDE_FIELDS)[number];

/** One active override as stored with the member and shown on its sheet. */
export interface ActiveOverride {
  value: string | number;
  reason: string;
  by: string;
  at: string;
}
export type ActiveOverrides = Partial<Record<OverrideField, ActiveOverride>>;

/** One audit entry of a member, newest first. */
export interface MemberAuditEntry {
  at: string;
  by: string | null;
  action: string;
  change: Record<string, { before: unknown; after: unknown }>;
  reason: string | null;
}
