// Thin wrappers over the shared lighting math; its input errors become 422 problems.
import { Injectable } from '@nestjs/common';
import {
  computeBacklight,
  computeFalloff,
  computeFlash,
  computeTwilight,
  LightingInputError,
  planDuskSetup,
  solveBalance,
  solveExposure,
  type BacklightInput,
  type BalanceInput,
  type DuskSetupInput,
  type ExposureInput,
  type FalloffInput,
  type FlashInput,
  type TwilightInput,
} from '@lumenwright/shared';
import { DomainError } from '../common/errors/domain-error.js';

/**
 * Where gear referred to by id (an organisation's gel kit or lights) will be resolved into the
 * plain values the math takes. Until the gear feature exists, requests list gels inline.
 */
export interface GearResolver {
  resolveBalance(organizationId: string, input: BalanceInput): Promise<BalanceInput>;
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
  twilight = (input: TwilightInput) => run(() => computeTwilight(input));
  exposure = (input: ExposureInput) => run(() => solveExposure(input));
  flash = (input: FlashInput) => run(() => computeFlash(input));
  falloff = (input: FalloffInput) => run(() => computeFalloff(input));
  backlight = (input: BacklightInput) => run(() => computeBacklight(input));
  balance = (input: BalanceInput) => run(() => solveBalance(input));
  setup = (input: DuskSetupInput) => run(() => planDuskSetup(input));
}
