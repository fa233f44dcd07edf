// Feature modules, one line each. Add yours at the end.
import type { Type } from '@nestjs/common';

export const FEATURE_MODULES: Type[] = [];
