// Thin wrappers over the shared lighting math; its input errors become 422 problems.
import { Injectable, Optional } from '@nestjs/common';
import {
  computeBacklight,
  computeFalloff,
  computeFlash,
  computeTwilight,
  LightingInputError,
  planDuskSetup,
  planEveningTimeline,
  solveBalance,
  solveBackgroundExposure,
  solveExposure,
  type BacklightInput,
  type BalanceInput,
  type DuskSetupInput,
  type BackgroundExposureInput,
  type ExposureInput,
  type FalloffInput,
  type FlashInput,
  type TimelineInput,
  type TwilightInput,
} from '@lumenwright/shared';
import { DomainError } from '../common/errors/domain-error.js';
import { BACKGROUND_FIELDS } from './schemas/exposure.schema.js';
import { GearReferenceResolver, hasGearRefs } from '../gear/gear-reference.resolver.js';
import type { GearRefs } from '../gear/gear-refs.schema.js';

/**
 * Turns gear referred to by id (the organisation's gel kits, lights, modifiers) into the plain
 * values the math takes; implemented by the gear feature.
 */
export interface GearResolver {
  resolveBalance(organizationId: string, input: BalanceInput & GearRefs): Promise<BalanceInput>;
  resolveSetup(organizationId: string, input: DuskSetupInput & GearRefs): Promise<DuskSetupInput>;
  resolveFlash(organizationId: string, input: FlashInput & GearRefs): Promise<FlashInput>;
}

function run<T>(fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (e instanceof LightingInputError) {
      throw new DomainError('invalid_input', `${e.field} ${e.reason}.`, [
        { field: e.field, reason: e.reason },
      ]);
    }
    throw e;
  }
}

@Injectable()
export class ComputeService {
  constructor(@Optional() private readonly gear?: GearReferenceResolver) {}

  /** Balance for a caller: gear ids resolved first (only when the body has any). */
  balanceFor(organizationId: string, input: BalanceInput & GearRefs) {
    if (!this.gear || !hasGearRefs(input)) return this.balance(input);
    return this.gear.resolveBalance(organizationId, input).then((i) => this.balance(i));
  }

  /** Flash power for a caller, its light and modifier ids resolved first. */
  flashFor(organizationId: string, input: FlashInput & GearRefs) {
    if (!this.gear || !hasGearRefs(input)) return this.flash(input);
    return this.gear.resolveFlash(organizationId, input).then((i) => this.flash(i));
  }

  /** The dusk setup for a caller, gear ids resolved first. */
  setupFor(organizationId: string, input: DuskSetupInput & GearRefs) {
    if (!this.gear || !hasGearRefs(input)) return this.setup(input);
    return this.gear.resolveSetup(organizationId, input).then((i) => this.setup(i));
  }

  twilight = (input: TwilightInput) => run(() => computeTwilight(input));
  exposure = (input: ExposureInput | BackgroundExposureInput) =>
    run(() =>
      BACKGROUND_FIELDS.some((f) => (input as Record<string, unknown>)[f] !== undefined)
        ? solveBackgroundExposure(input as BackgroundExposureInput)
        : solveExposure(input as ExposureInput),
    );
  flash = (input: FlashInput) => run(() => computeFlash(input));
  falloff = (input: FalloffInput) => run(() => computeFalloff(input));
  backlight = (input: BacklightInput) => run(() => computeBacklight(input));
  balance = (input: BalanceInput) => run(() => solveBalance(input));
  setup = (input: DuskSetupInput) => run(() => planDuskSetup(input));
  timeline = (input: TimelineInput) => run(() => planEveningTimeline(input));
}
