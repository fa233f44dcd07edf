import { Controller, Get } from '@nestjs/common';
import {
  ApiOkResponse,
  ApiOperation,
  ApiServiceUnavailableResponse,
  ApiTags,
} from '@nestjs/swagger';
import { HealthCheck, HealthCheckService, TypeOrmHealthIndicator } from '@nestjs/terminus';
import { Public } from '../common/decorators/access.decorator.js';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(
    private readonly health: HealthCheckService,
    private readonly db: TypeOrmHealthIndicator,
  ) {}

  @Get()
  @Public()
  @HealthCheck()
  @ApiOperation({ summary: 'Service health: the API and its database.' })
  @ApiOkResponse({ description: 'Everything is up.' })
  @ApiServiceUnavailableResponse({ description: 'A dependency (the database) is down.' })
  getHealth() {
    return this.health.check([() => this.db.pingCheck('database', { timeout: 1500 })]);
  }
}
