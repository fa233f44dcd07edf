// Turns gear named by id into the plain values the math takes, within the caller's organisation
// only: another organisation's id is a 404 naming the field, exactly like an unknown one.
import { Injectable } from '@nestjs/common';
import {
  fromMetres,
  toMetres,
  type BalanceInput,
  type DuskSetupInput,
  type FlashInput,
} from '@lumenwright/shared';
import { DomainError } from '../common/errors/domain-error.js';
import type { GearResolver } from '../compute/compute.service.js';
import type { GearRefs } from './gear-refs.schema.js';
import type { GelKitEntity } from './entities/gel-kit.entity.js';
import { GelKitsService } from './gel-kits.service.js';
import { LightsService } from './lights.service.js';
import { ModifiersService } from './modifiers.service.js';

type Obj = Record<string, unknown>;

const both = (field: string, other: string) =>
  new DomainError('invalid_input', `Send ${field} or ${other}, not both.`, [
    { field, reason: `cannot be sent together with ${other}` },
  ]);

export function kitGels(kit: GelKitEntity): NonNullable<BalanceInput['gels']> {
  return [...(kit.pieces ?? [])]
    .sort((a, b) => a.position - b.position)
    .map((p) => ({
      name: p.name,
      miredShift: p.miredShift,
      greenShift: p.greenShift,
      lossStops: p.lossStops,
    }));
}

/** True when the body names any gear by id (the compute hot path can skip the resolver). */
export function hasGearRefs(body: unknown): boolean {
  const b = body as GearRefs | null;
  return !!b && (b.gelKitId !== undefined || refsIn(b) || refsIn(b.key) || refsIn(b.rim));
}
const refsIn = (o: GearRefs['key']) =>
  !!o && typeof o === 'object' && (o.lightId !== undefined || o.modifierId !== undefined);

@Injectable()
export class GearReferenceResolver implements GearResolver {
  constructor(
    private readonly lights: LightsService,
    private readonly modifiers: ModifiersService,
    private readonly kits: GelKitsService,
  ) {}

  /** `gelKitId` → `gels`. `prefix` is put before field names in errors (e.g. "inputs."). */
  async resolveBalance<T extends BalanceInput>(
    organizationId: string,
    input: T & GearRefs,
    prefix = '',
  ): Promise<T> {
    if (input.gelKitId === undefined) return input;
    const { gelKitId, ...rest } = input;
    if (rest.gels !== undefined) throw both(`${prefix}gelKitId`, `${prefix}gels`);
    const kit = await this.kits.get(organizationId, gelKitId, `${prefix}gelKitId`);
    return { ...rest, gels: kitGels(kit) } as unknown as T;
  }

  /** Gel kit, lights and modifiers of a setup request → values. */
  async resolveSetup(
    organizationId: string,
    input: DuskSetupInput & GearRefs,
    prefix = '',
  ): Promise<DuskSetupInput> {
    const withGels = await this.resolveBalance(organizationId, input as never, prefix);
    const out = { ...(withGels as Obj) };
    out.key = await this.resolveKey(organizationId, input.key as Obj | undefined, prefix);
    if (input.rim !== undefined)
      out.rim = await this.resolveRim(organizationId, input.rim as Obj, prefix);
    else delete out.rim;
    return out as unknown as DuskSetupInput;
  }

  /** A flash request's `lightId` → guide number and unit, `modifierId` → its loss. */
  async resolveFlash(organizationId: string, input: FlashInput & GearRefs): Promise<FlashInput> {
    const out = await this.resolveLight(organizationId, input as unknown as Obj, '');
    if (input.modifierId === undefined) return out as unknown as FlashInput;
    if (input.modifierLossStops !== undefined) throw both('modifierId', 'modifierLossStops');
    const { modifierId, ...rest } = out;
    const m = await this.modifiers.get(organizationId, modifierId as string, 'modifierId');
    return { ...rest, modifierLossStops: m.lossStops } as unknown as FlashInput;
  }

  private async resolveKey(
    org: string,
    key: Obj | undefined,
    prefix: string,
  ): Promise<Obj | undefined> {
    if (!key) return key;
    const p = `${prefix}key`;
    const out = await this.resolveLight(org, key, p);
    if (key.modifierId === undefined) return out;
    if (key.modifierLossStops !== undefined)
      throw both(`${p}.modifierId`, `${p}.modifierLossStops`);
    const { modifierId, ...rest } = out;
    const m = await this.modifiers.get(org, modifierId as string, `${p}.modifierId`);
    const resolved: Obj = { ...rest, modifierLossStops: m.lossStops };
    // The saved modifier says what kind it is; a different kind beside it is a contradiction.
    if (m.kind && rest.modifier !== undefined && rest.modifier !== m.kind) {
      throw new DomainError(
        'invalid_input',
        `${p}.modifier (${String(rest.modifier)}) differs from the kind of ${p}.modifierId (${m.kind}).`,
        [
          {
            field: `${p}.modifier`,
            reason: `must match ${p}.modifierId's kind (${m.kind}) or be left out`,
          },
        ],
      );
    }
    if (m.kind && rest.modifier === undefined) resolved.modifier = m.kind;
    if (m.size !== null && rest.modifierSize === undefined) {
      const unit = rest.distanceUnit === 'ft' ? 'ft' : 'm';
      const size = fromMetres(toMetres(m.size, m.sizeUnit ?? 'm'), unit);
      resolved.modifierSize = Math.round(size * 10_000) / 10_000;
    }
    return resolved;
  }

  private async resolveRim(org: string, rim: Obj, prefix: string): Promise<Obj> {
    const p = `${prefix}rim`;
    const out = await this.resolveLight(org, rim, p);
    if (rim.modifierId === undefined) return out;
    if (rim.modifierLossStops !== undefined)
      throw both(`${p}.modifierId`, `${p}.modifierLossStops`);
    const { modifierId, ...rest } = out;
    const m = await this.modifiers.get(org, modifierId as string, `${p}.modifierId`);
    const resolved: Obj = { ...rest, modifierLossStops: m.lossStops };
    if (m.beamAngleDeg !== null && rest.beamAngleDeg === undefined)
      resolved.beamAngleDeg = m.beamAngleDeg;
    return resolved;
  }

  /**
   * `lightId` → guideNumber + guideNumberUnit; one of the two ways must be there. `p` is the
   * object's path in the request ('' for a flash request's top level).
   */
  private async resolveLight(org: string, o: Obj, p: string): Promise<Obj> {
    const f = (name: string) => (p ? `${p}.${name}` : name);
    if (o.lightId === undefined) {
      if (o.guideNumber === undefined) {
        throw new DomainError('invalid_input', `${f('guideNumber')} is required.`, [
          { field: f('guideNumber'), reason: `is required unless ${f('lightId')} is sent` },
        ]);
      }
      return o;
    }
    if (o.guideNumber !== undefined) throw both(f('lightId'), f('guideNumber'));
    if (o.guideNumberUnit !== undefined) throw both(f('lightId'), f('guideNumberUnit'));
    const { lightId, ...rest } = o;
    const light = await this.lights.get(org, lightId as string, f('lightId'));
    return { ...rest, guideNumber: light.guideNumber, guideNumberUnit: light.guideNumberUnit };
  }
}
