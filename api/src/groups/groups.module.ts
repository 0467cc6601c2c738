import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { GroupVersionEntity } from './group-version.entity';
import { GroupsController } from './groups.controller';
import { GroupsService } from './groups.service';
import { ReferenceGroupEntity } from './reference-group.entity';

@Module({
  imports: [TypeOrmModule.forFeature([ReferenceGroupEntity, GroupVersionEntity])],
  controllers: [GroupsController],
  providers: [GroupsService],
  exports: [GroupsService],
})
export class GroupsModule {}
