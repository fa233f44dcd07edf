// The gear feature's entities, registered in src/database/entities.ts with one spread.
import { GelKitEntity } from './entities/gel-kit.entity.js';
import { GelPieceEntity } from './entities/gel-piece.entity.js';
import { LightEntity } from './entities/light.entity.js';
import { ModifierEntity } from './entities/modifier.entity.js';

export const GEAR_ENTITIES = [LightEntity, ModifierEntity, GelKitEntity, GelPieceEntity];
