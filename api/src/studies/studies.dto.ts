import { createZodDto } from 'nestjs-zod';
import {
  checkResultsQuerySchema,
  copyStudySchema,
  createOverrideSchema,
  createStudySchema,
  signOffSchema,
  updateStepSchema,
  updateStudySchema,
} from '@provenote/shared';

export class CreateStudyDto extends createZodDto(createStudySchema) {}
export class UpdateStudyDto extends createZodDto(updateStudySchema) {}
export class CopyStudyDto extends createZodDto(copyStudySchema) {}
export class UpdateStepDto extends createZodDto(updateStepSchema) {}
export class CreateOverrideDto extends createZodDto(createOverrideSchema) {}
export class SignOffDto extends createZodDto(signOffSchema) {}
export class CheckResultsQueryDto extends createZodDto(checkResultsQuerySchema) {}
