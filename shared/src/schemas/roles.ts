import { z } from 'zod';

/** The four roles a person can hold in a lab, from most to least privileged. */
export const labRoles = ['pi', 'analyst', 'student', 'guest'] as const;
export const labRoleSchema = z.enum(labRoles);
export type LabRole = z.infer<typeof labRoleSchema>;

/** Plain-language descriptions shown wherever a role is chosen or displayed. */
export const labRoleDescriptions: Record<LabRole, { label: string; description: string }> = {
  pi: {
    label: 'Principal investigator',
    description: 'Runs the lab: everything analysts can do, plus members, sign-off, exports and deletes.',
  },
  analyst: {
    label: 'Analyst',
    description: 'Imports datasets, builds and vets reference groups, runs group checks and assignments.',
  },
  student: {
    label: 'Student',
    description:
      'Uploads unknowns, runs the group check and assigns against reference groups once they are approved; reads everything.',
  },
  guest: {
    label: 'Guest',
    description: 'Reads studies and results (a co-author or reviewer); changes nothing.',
  },
};
