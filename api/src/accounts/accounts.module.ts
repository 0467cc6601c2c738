import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { Lab } from './lab.entity';
import { LabsController } from './labs.controller';
import { LabsService } from './labs.service';
import { MeController } from './me.controller';
import { Membership } from './membership.entity';
import { User } from './user.entity';

@Module({
  imports: [TypeOrmModule.forFeature([User, Lab, Membership])],
  controllers: [MeController, LabsController],
  providers: [LabsService],
  exports: [LabsService],
})
export class AccountsModule {}
