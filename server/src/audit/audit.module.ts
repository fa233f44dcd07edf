import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { UserEntity } from '../users/user.entity.js';
import { AuditEventEntity } from './audit-event.entity.js';
import { AuditController } from './audit.controller.js';
import { AuditService } from './audit.service.js';

/** Global: every feature records audit events through AuditService. */
@Global()
@Module({
  imports: [TypeOrmModule.forFeature([AuditEventEntity, UserEntity])],
  controllers: [AuditController],
  providers: [AuditService],
  exports: [AuditService],
})
export class AuditModule {}
