import { z } from 'zod';
import { ROLES } from './roles';

export const STANDARDS = ['as4100', 'aisc360-lrfd', 'aisc360-asd', 'en1993'] as const;
export type StandardId = (typeof STANDARDS)[number];
export const STANDARD_LABELS: Record<StandardId, string> = {
  as4100: 'AS 4100',
  'aisc360-lrfd': 'AISC 360 (LRFD)',
  'aisc360-asd': 'AISC 360 (ASD)',
  en1993: 'EN 1993-1-1 / 1-8',
};

export const projectSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string(),
  standard: z.enum(STANDARDS),
  defaultGrade: z.string(),
  /** People with access to the project (not steel members). */
  peopleCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Project = z.infer<typeof projectSchema>;
export const projectListSchema = z.object({ projects: z.array(projectSchema) });

const projectName = z.string().trim().min(2, 'Use at least 2 characters').max(120, 'Use at most 120 characters');

/** POST /api/projects (admin, engineer) */
export const createProjectRequestSchema = z.object({
  name: projectName,
  description: z.string().trim().max(2000).optional(),
  standard: z.enum(STANDARDS).optional(),
  defaultGrade: z.string().trim().min(1).max(60).optional(),
});
export type CreateProjectRequest = z.infer<typeof createProjectRequestSchema>;

/** PATCH /api/projects/:id (admin, or an engineer who is a member) */
export const updateProjectRequestSchema = z
  .object({
    name: projectName.optional(),
    description: z.string().trim().max(2000).optional(),
    standard: z.enum(STANDARDS).optional(),
    defaultGrade: z.string().trim().min(1).max(60).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateProjectRequest = z.infer<typeof updateProjectRequestSchema>;

/** A member of a project (GET /api/projects/:id/members). */
export const projectMemberSchema = z.object({
  userId: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  addedAt: z.string(),
});
export type ProjectMember = z.infer<typeof projectMemberSchema>;
export const projectMemberListSchema = z.object({ members: z.array(projectMemberSchema) });
