import { Controller, Get, Param, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { createZodDto } from 'nestjs-zod';
import { auditQuerySchema, type AuditPage } from '@provenote/shared';
import { Roles } from '../auth/roles.decorator';
import { AuditService } from './audit.service';

class AuditQueryDto extends createZodDto(auditQuerySchema) {}

@ApiTags('audit')
@Controller('labs/:labId/audit')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  @Roles('pi')
  @Get()
  list(@Param('labId') labId: string, @Query() query: AuditQueryDto): Promise<AuditPage> {
    return this.audit.list(labId, query);
  }
}
