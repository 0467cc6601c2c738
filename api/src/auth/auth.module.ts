import { Global, Module } from '@nestjs/common';
import { APP_GUARD } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AccountsModule } from '../accounts/accounts.module';
import { Lab } from '../accounts/lab.entity';
import { Membership } from '../accounts/membership.entity';
import { User } from '../accounts/user.entity';
import { AuthController } from './auth.controller';
import { AccessGuard } from './access.guard';
import { DemoAccountsService } from './demo-accounts.service';
import { MailToken } from './mail-token.entity';
import { MailTokenService } from './mail-token.service';
import { PasswordResetService } from './password-reset.service';
import { Session } from './session.entity';
import { SignUpService } from './sign-up.service';
import { SessionService } from './session.service';
import { SignInService } from './sign-in.service';

@Global()
@Module({
  imports: [TypeOrmModule.forFeature([Session, MailToken, Membership, User, Lab]), AccountsModule],
  controllers: [AuthController],
  providers: [
    SessionService,
    SignInService,
    SignUpService,
    PasswordResetService,
    MailTokenService,
    DemoAccountsService,
    { provide: APP_GUARD, useClass: AccessGuard },
  ],
  exports: [SessionService, SignInService],
})
export class AuthModule {}
