import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { ApiKeyEntity } from './api-key.entity.js';
import { ApiKeysController } from './api-keys.controller.js';
import { ApiKeysService } from './api-keys.service.js';
import { KeyVerifier } from './key-verifier.service.js';
import { LastUsedRecorder } from './last-used.recorder.js';

@Module({
  imports: [TypeOrmModule.forFeature([ApiKeyEntity, UserEntity, OrganizationEntity])],
  controllers: [ApiKeysController],
  providers: [ApiKeysService, KeyVerifier, LastUsedRecorder],
  exports: [ApiKeysService, KeyVerifier, LastUsedRecorder],
})
export class ApiKeysModule {}
