// Balance and setup requests may name the organisation's gear by id (gel kit, lights,
// modifiers) instead of listing values: their documented and validated schemas are the gear
// feature's extensions of the plain ones.
import {
  gearBalanceRequestSchema,
  gearFlashRequestSchema,
  gearSetupRequestSchema,
} from '../../gear/gear-refs.schema.js';
import { schemaDto } from '../validation/schema-dto.js';

export { gearBalanceRequestSchema, gearFlashRequestSchema, gearSetupRequestSchema };
export const BalanceRequestDto = schemaDto('BalanceRequestDto', gearBalanceRequestSchema);
export const SetupRequestDto = schemaDto('SetupRequestDto', gearSetupRequestSchema);
export const FlashRequestDto = schemaDto('FlashRequestDto', gearFlashRequestSchema);
