import { createZodDto } from 'nestjs-zod';
import {
  createGroupSchema,
  createGroupVersionSchema,
  groupsFromColumnSchema,
  updateGroupSchema,
} from '@provenote/shared';

export class CreateGroupDto extends createZodDto(createGroupSchema) {}
export class UpdateGroupDto extends createZodDto(updateGroupSchema) {}
export class CreateGroupVersionDto extends createZodDto(createGroupVersionSchema) {}
export class GroupsFromColumnDto extends createZodDto(groupsFromColumnSchema) {}
