import { z } from 'zod';
import type { JsonSchemaNode } from '../source/check-written.js';
import { writtenPlanSchema } from './schema.js';

export const PLAN_SCHEMA_ID = 'https://plumbline.dev/schema/plan.schema.json';

let cached: JsonSchemaNode | undefined;

/** The plan file's JSON Schema, generated from the zod schema (the single source); computed once. */
export function planJsonSchema(): JsonSchemaNode {
  cached ??= {
    $id: PLAN_SCHEMA_ID,
    title: 'Plumbline experiment plan',
    ...(z.toJSONSchema(writtenPlanSchema, { io: 'input', target: 'draft-2020-12', unrepresentable: 'any' }) as JsonSchemaNode),
  };
  return cached;
}
