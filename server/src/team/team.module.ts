import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MembershipEntity } from '../organizations/membership.entity.js';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { InviteEntity } from './invite.entity.js';
import { InvitesController } from './invites.controller.js';
import { InvitesService } from './invites.service.js';
import { TeamController } from './team.controller.js';
import { TeamService } from './team.service.js';

@Module({
  imports: [
    TypeOrmModule.forFeature([InviteEntity, UserEntity, OrganizationEntity, MembershipEntity]),
  ],
  controllers: [TeamController, InvitesController],
  providers: [TeamService, InvitesService],
  exports: [TeamService],
})
export class TeamModule {}
