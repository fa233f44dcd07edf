// The balance, setup and flash request schemas, extended so a request may name the organisation's
// gear by id instead of listing values: `gelKitId` instead of `gels`; `key.lightId`/`rim.lightId`
// (or `lightId` for a flash) instead of a guide number; `key.modifierId`/`rim.modifierId` (or
// `modifierId`) instead of the modifier's loss.
// GearReferenceResolver turns the ids into values before the math runs.
import { balanceRequestSchema } from '../compute/schemas/balance.schema.js';
import { flashRequestSchema } from '../compute/schemas/flash.schema.js';
import { setupRequestSchema } from '../compute/schemas/setup.schema.js';
import { UUID_PATTERN, type JsonSchema } from '../compute/validation/json-schema.js';
import type { ObjectSchema } from '../compute/validation/schema-dto.js';

const ref = (description: string): JsonSchema => ({
  type: 'string',
  pattern: UUID_PATTERN,
  description,
  example: '0b7c6a52-3d0e-4c55-9f59-2b1f4e0d8a11',
});

const GEL_KIT_ID = ref(
  'Id of one of your gel kits (GET /v1/gear/gel-kits): its pieces are the gels to choose from. Send this or `gels`, not both.',
);

/**
 * A light's schema with `lightId` and `modifierId` beside the values they stand for. `role` is
 * the object's place in the request (`key`, `rim`), or null for a flash request's top level.
 */
function withLightRefs<S extends JsonSchema>(schema: S | undefined, role: 'key' | 'rim' | null): S {
  const s = schema ?? ({ type: 'object', properties: {} } as JsonSchema as S);
  const at = (name: string) => (role ? `${role}.${name}` : name);
  const gives = role === 'rim' ? ' and beam angle' : role === 'key' ? ', kind and size' : '';
  return {
    ...s,
    description:
      `${s.description ?? ''} Name a light and modifier of your gear by id, or give the values.`.trim(),
    // The guide number may come from the light instead; the resolver checks one of them is there.
    required: (s.required ?? []).filter((r) => r !== 'guideNumber'),
    properties: {
      ...s.properties,
      lightId: ref(
        `Id of one of your lights (GET /v1/gear/lights): its guide number and unit. Send this or ${at('guideNumber')}.`,
      ),
      modifierId: ref(
        `Id of one of your modifiers (GET /v1/gear/modifiers): its loss${gives}. Send this or ${at('modifierLossStops')}.`,
      ),
    },
  };
}

export const gearBalanceRequestSchema: ObjectSchema = {
  ...balanceRequestSchema,
  properties: { ...balanceRequestSchema.properties, gelKitId: GEL_KIT_ID },
};

export const gearSetupRequestSchema: ObjectSchema = {
  ...setupRequestSchema,
  properties: {
    ...setupRequestSchema.properties,
    gelKitId: GEL_KIT_ID,
    key: withLightRefs(setupRequestSchema.properties.key, 'key'),
    rim: withLightRefs(setupRequestSchema.properties.rim, 'rim'),
  },
};

export const gearFlashRequestSchema: ObjectSchema = withLightRefs(flashRequestSchema, null);

/** The gear references a request may carry. */
export interface GearRefs {
  gelKitId?: string;
  /** A flash request's own light and modifier. */
  lightId?: string;
  modifierId?: string;
  key?: { lightId?: string; modifierId?: string };
  rim?: { lightId?: string; modifierId?: string };
}
