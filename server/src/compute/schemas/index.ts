// Request and response schemas by endpoint name (tests and the SDK checks use these).
import type { JsonSchema } from '../validation/json-schema.js';
import { backlightRequestSchema, backlightResponseSchema } from './backlight.schema.js';
import { balanceRequestSchema, balanceResponseSchema } from './balance.schema.js';
import { exposureRequestSchema, exposureResponseSchema } from './exposure.schema.js';
import { falloffRequestSchema, falloffResponseSchema } from './falloff.schema.js';
import { flashRequestSchema, flashResponseSchema } from './flash.schema.js';
import { setupRequestSchema, setupResponseSchema } from './setup.schema.js';
import { timelineRequestSchema, timelineResponseSchema } from './timeline.schema.js';
import { twilightRequestSchema, twilightResponseSchema } from './twilight.schema.js';

export const REQUEST_SCHEMAS: Record<string, JsonSchema> = {
  twilight: twilightRequestSchema,
  exposure: exposureRequestSchema,
  flash: flashRequestSchema,
  falloff: falloffRequestSchema,
  backlight: backlightRequestSchema,
  balance: balanceRequestSchema,
  setup: setupRequestSchema,
  timeline: timelineRequestSchema,
};

export const RESPONSE_SCHEMAS: Record<string, JsonSchema> = {
  twilight: twilightResponseSchema,
  exposure: exposureResponseSchema,
  flash: flashResponseSchema,
  falloff: falloffResponseSchema,
  backlight: backlightResponseSchema,
  balance: balanceResponseSchema,
  setup: setupResponseSchema,
  timeline: timelineResponseSchema,
};
