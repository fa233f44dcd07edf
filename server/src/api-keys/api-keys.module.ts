import { Module } from '@nestjs/common';
import { PassportModule } from '@nestjs/passport';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { ApiKeyEntity } from './api-key.entity.js';
import { ApiKeysController } from './api-keys.controller.js';
import { ApiKeysService } from './api-keys.service.js';
import { BearerStrategy } from './bearer.strategy.js';
import { KeyVerifier } from './key-verifier.service.js';
import { LastUsedRecorder } from './last-used.recorder.js';

@Module({
  imports: [
    PassportModule,
    TypeOrmModule.forFeature([ApiKeyEntity, UserEntity, OrganizationEntity]),
  ],
  controllers: [ApiKeysController],
  providers: [ApiKeysService, KeyVerifier, LastUsedRecorder, BearerStrategy],
  exports: [ApiKeysService, KeyVerifier, BearerStrategy, LastUsedRecorder],
})
export class ApiKeysModule {}
