import { Body, Controller, Req } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type {
  BacklightInput,
  BackgroundExposureInput,
  BalanceInput,
  DuskSetupInput,
  ExposureInput,
  FalloffInput,
  FlashInput,
  TimelineInput,
  TwilightInput,
} from '@lumenwright/shared';
import type { RequestWithPrincipal } from '../common/guards/access.guard.js';
import type { GearRefs } from '../gear/gear-refs.schema.js';
import { ComputeRoute } from './compute.decorator.js';
import { ComputeService } from './compute.service.js';
import { SchemaPipe } from './validation/schema-dto.js';
import * as backlight from './schemas/backlight.schema.js';
import * as balance from './schemas/balance.schema.js';
import * as exposure from './schemas/exposure.schema.js';
import * as falloff from './schemas/falloff.schema.js';
import * as flash from './schemas/flash.schema.js';
import * as gearAware from './schemas/gear-aware.dto.js';
import * as setup from './schemas/setup.schema.js';
import * as timeline from './schemas/timeline.schema.js';
import * as twilight from './schemas/twilight.schema.js';

@ApiTags('compute')
@Controller()
export class ComputeController {
  constructor(private readonly compute: ComputeService) {}

  @ComputeRoute(
    'twilight',
    'Sun events, golden and blue hour, and the ambient-light timeline for a place and date.',
    twilight.TwilightRequestDto,
    twilight.TwilightResponseDto,
  )
  computeTwilight(@Body(new SchemaPipe(twilight.twilightRequestSchema)) body: TwilightInput) {
    return this.compute.twilight(body);
  }

  @ComputeRoute(
    'exposure',
    'Solve shutter, aperture or ISO for a scene EV (APEX), or the background exposure at dusk.',
    exposure.ExposureRequestDto,
    exposure.ExposureResponseDto,
  )
  solveExposure(
    @Body(new SchemaPipe(exposure.exposureRequestSchema))
    body: ExposureInput | BackgroundExposureInput,
  ) {
    return this.compute.exposure(body);
  }

  @ComputeRoute(
    'flash',
    'Flash power for a distance and aperture from the guide number.',
    gearAware.FlashRequestDto,
    flash.FlashResponseDto,
    { gearIds: true },
  )
  computeFlash(
    @Req() req: RequestWithPrincipal,
    @Body(new SchemaPipe(gearAware.gearFlashRequestSchema)) body: FlashInput & GearRefs,
  ) {
    return this.compute.flashFor(req.principal!.organizationId, body);
  }

  @ComputeRoute(
    'falloff',
    'Inverse-square falloff from the subject to background and ground.',
    falloff.FalloffRequestDto,
    falloff.FalloffResponseDto,
  )
  computeFalloff(@Body(new SchemaPipe(falloff.falloffRequestSchema)) body: FalloffInput) {
    return this.compute.falloff(body);
  }

  @ComputeRoute(
    'backlight',
    'Rim-light geometry: head in the beam, ground spill.',
    backlight.BacklightRequestDto,
    backlight.BacklightResponseDto,
  )
  computeBacklight(@Body(new SchemaPipe(backlight.backlightRequestSchema)) body: BacklightInput) {
    return this.compute.backlight(body);
  }

  @ComputeRoute(
    'balance',
    'Gels for the flash to match the camera white balance, in mireds.',
    gearAware.BalanceRequestDto,
    balance.BalanceResponseDto,
    { gearIds: true },
  )
  solveBalance(
    @Req() req: RequestWithPrincipal,
    @Body(new SchemaPipe(gearAware.gearBalanceRequestSchema)) body: BalanceInput & GearRefs,
  ) {
    return this.compute.balanceFor(req.principal!.organizationId, body);
  }

  @ComputeRoute(
    'setup',
    'The whole dusk setup: timing, background exposure, key and rim power, gels, cautions.',
    gearAware.SetupRequestDto,
    setup.SetupResponseDto,
    { gearIds: true },
  )
  planSetup(
    @Req() req: RequestWithPrincipal,
    @Body(new SchemaPipe(gearAware.gearSetupRequestSchema)) body: DuskSetupInput & GearRefs,
  ) {
    return this.compute.setupFor(req.principal!.organizationId, body);
  }

  @ComputeRoute(
    'timeline',
    'The evening as a timeline: twilight phases and booked events in time order, and portrait ' +
      'slots in the blue hour (else sunset to civil dusk) clear of the events and the set-up.',
    timeline.TimelineRequestDto,
    timeline.TimelineResponseDto,
  )
  planTimeline(@Body(new SchemaPipe(timeline.timelineRequestSchema)) body: TimelineInput) {
    return this.compute.timeline(body);
  }
}
