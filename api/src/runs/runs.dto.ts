import { createZodDto, ZodValidationPipe } from 'nestjs-zod';
import { assignmentsQuerySchema, createRunRequestSchema } from '@provenote/shared';

/** The create-run body is a union by kind, which a DTO class cannot express: it is checked by this pipe. */
export const createRunBodyPipe = new ZodValidationPipe(createRunRequestSchema);
export class AssignmentsQueryDto extends createZodDto(assignmentsQuerySchema) {}
