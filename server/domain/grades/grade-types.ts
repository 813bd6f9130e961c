import type { z } from '../../lib/zod.ts';
import type { UpdateGradeRequestSchema } from './grades.schemas.ts';

/** A grade's definition as validated: everything but its code and version. */
export type GradeDefinitionInput = z.output<typeof UpdateGradeRequestSchema>;
