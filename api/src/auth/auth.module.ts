import { Global, Module } from '@nestjs/common';
import { APP_GUARD } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { Membership } from '../accounts/membership.entity';
import { User } from '../accounts/user.entity';
import { AuthController } from './auth.controller';
import { AccessGuard } from './access.guard';
import { Session } from './session.entity';
import { SessionService } from './session.service';
import { SignInService } from './sign-in.service';

@Global()
@Module({
  imports: [TypeOrmModule.forFeature([Session, Membership, User])],
  controllers: [AuthController],
  providers: [SessionService, SignInService, { provide: APP_GUARD, useClass: AccessGuard }],
  exports: [SessionService],
})
export class AuthModule {}
