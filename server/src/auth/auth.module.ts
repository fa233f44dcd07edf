import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ApiKeysModule } from '../api-keys/api-keys.module.js';
import { AUTHENTICATOR } from '../common/guards/access.guard.js';
import { MembershipEntity } from '../organizations/membership.entity.js';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { AuthController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { AccountsAuthenticator } from './authenticator.service.js';
import { MeController } from './me.controller.js';
import { WhoAmIController } from './whoami.controller.js';
import { SessionManager } from './session-manager.js';
import { AttemptThrottle } from './attempt-throttle.service.js';
import { UserTokenEntity } from './user-token.entity.js';

/** Global so the app-level AccessGuard can inject the AUTHENTICATOR. */
@Global()
@Module({
  imports: [
    ApiKeysModule,
    TypeOrmModule.forFeature([UserEntity, OrganizationEntity, MembershipEntity, UserTokenEntity]),
  ],
  controllers: [AuthController, MeController, WhoAmIController],
  providers: [
    AuthService,
    SessionManager,
    AttemptThrottle,
    AccountsAuthenticator,
    { provide: AUTHENTICATOR, useExisting: AccountsAuthenticator },
  ],
  exports: [AUTHENTICATOR, AuthService, SessionManager, AttemptThrottle],
})
export class AuthModule {}
