import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { InvitationLinksController } from './invitation-links.controller';
import { Invitation } from './invitation.entity';
import { InvitationsController } from './invitations.controller';
import { InvitationsService } from './invitations.service';
import { Lab } from './lab.entity';
import { LabsController } from './labs.controller';
import { LabsService } from './labs.service';
import { MeController } from './me.controller';
import { MembersController } from './members.controller';
import { MembersService } from './members.service';
import { Membership } from './membership.entity';
import { User } from './user.entity';

@Module({
  imports: [TypeOrmModule.forFeature([User, Lab, Membership, Invitation])],
  controllers: [MeController, LabsController, MembersController, InvitationsController, InvitationLinksController],
  providers: [LabsService, MembersService, InvitationsService],
  exports: [LabsService],
})
export class AccountsModule {}
