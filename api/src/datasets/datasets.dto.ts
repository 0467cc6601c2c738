import { createDatasetSchema, createVersionSchema, pageQuerySchema, previewRequestSchema } from '@provenote/shared';
import { createZodDto } from 'nestjs-zod';
import { z } from 'zod';

export class CreateDatasetDto extends createZodDto(createDatasetSchema) {}
export class CreateVersionDto extends createZodDto(createVersionSchema) {}
export class PreviewRequestDto extends createZodDto(previewRequestSchema) {}
export class PageQueryDto extends createZodDto(pageQuerySchema) {}
export class ExportQueryDto extends createZodDto(
  z.object({ values: z.enum(['original', 'ppm']).default('original') }),
) {}
