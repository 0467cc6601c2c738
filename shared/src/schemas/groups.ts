import { z } from 'zod';

export const groupNameSchema = z
  .string()
  .trim()
  .min(1, { error: 'Give the group a name' })
  .max(120, { error: 'Use at most 120 characters' });

const groupDescriptionSchema = z.string().trim().max(5000, { error: 'Use at most 5000 characters' });

const memberIdsSchema = z
  .array(z.string().min(1))
  .min(1, { error: 'Choose at least one sample' })
  .max(100_000)
  .refine((ids) => new Set(ids).size === ids.length, { error: 'Each sample may be a member once' });

/** How a version's members were chosen: the dataset's group column, or picked by hand. */
export const groupSources = ['column', 'manual'] as const;
export const groupSourceSchema = z.enum(groupSources);

export const groupVersionSchema = z.object({
  id: z.uuid(),
  groupId: z.uuid(),
  number: z.number().int().min(1),
  datasetVersionId: z.uuid(),
  source: groupSourceSchema,
  memberIds: z.array(z.string()),
  note: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
  createdBy: z.string().nullable(),
  /** Students may assign only against approved versions; an approved version never changes. */
  approvedAt: z.iso.datetime({ offset: true }).nullable(),
  approvedBy: z.string().nullable(),
});
export type GroupVersion = z.infer<typeof groupVersionSchema>;

export const referenceGroupSchema = z.object({
  id: z.uuid(),
  labId: z.uuid(),
  name: z.string(),
  description: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
  /** Newest first. */
  versions: z.array(groupVersionSchema),
});
export type ReferenceGroup = z.infer<typeof referenceGroupSchema>;

/** GET /api/labs/:labId/groups */
export const referenceGroupListSchema = z.object({ groups: z.array(referenceGroupSchema) });
export type ReferenceGroupList = z.infer<typeof referenceGroupListSchema>;

/** POST /api/labs/:labId/groups — a group built by hand from chosen samples of one dataset version. */
export const createGroupSchema = z.object({
  name: groupNameSchema,
  description: groupDescriptionSchema.default(''),
  datasetVersionId: z.uuid({ error: 'Choose the dataset version the members come from' }),
  memberIds: memberIdsSchema,
});
export type CreateGroup = z.infer<typeof createGroupSchema>;

/** POST /api/labs/:labId/groups/from-column — one group per value of a reference dataset's group column. */
export const groupsFromColumnSchema = z.object({
  datasetVersionId: z.uuid({ error: 'Choose a reference dataset version' }),
});
export type GroupsFromColumn = z.infer<typeof groupsFromColumnSchema>;

/** PATCH /api/labs/:labId/groups/:groupId */
export const updateGroupSchema = z
  .object({ name: groupNameSchema.optional(), description: groupDescriptionSchema.optional() })
  .refine((u) => u.name !== undefined || u.description !== undefined, { error: 'Change the name or description' });
export type UpdateGroup = z.infer<typeof updateGroupSchema>;

/** POST /api/labs/:labId/groups/:groupId/versions — a new membership; earlier versions stay as they were. */
export const createGroupVersionSchema = z.object({
  datasetVersionId: z.uuid({ error: 'Choose the dataset version the members come from' }),
  memberIds: memberIdsSchema,
  note: z.string().trim().max(2000).default(''),
});
export type CreateGroupVersion = z.infer<typeof createGroupVersionSchema>;
