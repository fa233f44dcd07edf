// Validates saved-setup inputs, resolves gear named by id and computes the plan with the shared
// math. Every problem names its field under `inputs.` (the body property that holds them).
import { Injectable } from '@nestjs/common';
import { LightingInputError, planDuskSetup, type DuskSetupPlan } from '@lumenwright/shared';
import { DomainError } from '../common/errors/domain-error.js';
import { compileSchema } from '../compute/validation/json-schema.js';
import { GearReferenceResolver } from '../gear/gear-reference.resolver.js';
import { gearSetupRequestSchema, type GearRefs } from '../gear/gear-refs.schema.js';

const validateInputs = compileSchema(gearSetupRequestSchema);
const PREFIX = 'inputs';

export interface ComputedSetup {
  inputs: Record<string, unknown>;
  resolvedInputs: Record<string, unknown>;
  plan: DuskSetupPlan;
  date: string;
  timeZone: string;
}

@Injectable()
export class SetupPlanner {
  constructor(private readonly gear: GearReferenceResolver) {}

  async compute(organizationId: string, inputs: Record<string, unknown>): Promise<ComputedSetup> {
    const problems = validateInputs(inputs).map((p) => ({
      field: p.field === 'body' ? PREFIX : `${PREFIX}.${p.field}`,
      reason: p.reason,
    }));
    if (problems.length) {
      const first = problems[0]!;
      throw new DomainError('invalid_input', `${first.field} ${first.reason}.`, problems);
    }
    const resolved = await this.gear.resolveSetup(
      organizationId,
      inputs as unknown as Parameters<GearReferenceResolver['resolveSetup']>[1] & GearRefs,
      `${PREFIX}.`,
    );
    let plan: DuskSetupPlan;
    try {
      plan = planDuskSetup(resolved);
    } catch (e) {
      if (e instanceof LightingInputError) {
        const field = `${PREFIX}.${e.field}`;
        throw new DomainError('invalid_input', `${field} ${e.reason}.`, [
          { field, reason: e.reason },
        ]);
      }
      throw e;
    }
    return {
      inputs,
      resolvedInputs: resolved as unknown as Record<string, unknown>,
      plan,
      date: plan.twilight.date,
      timeZone: plan.twilight.timeZone,
    };
  }
}
