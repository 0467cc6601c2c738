import { Controller, Get } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Me } from '@provenote/shared';
import type { AuthUser } from '../auth/auth.types';
import { CurrentUser } from '../auth/current-user.decorator';
import { SignedIn } from '../auth/roles.decorator';
import { LabsService } from './labs.service';

@ApiTags('accounts')
@Controller('me')
export class MeController {
  constructor(private readonly labs: LabsService) {}

  /** The signed-in person and every lab they belong to, with their role there. */
  @SignedIn()
  @Get()
  async me(@CurrentUser() user: AuthUser): Promise<Me> {
    return { user, memberships: await this.labs.membershipsOf(user.id) };
  }
}
