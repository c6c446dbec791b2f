import { z } from 'zod';
import { aircraftTypeDefinitionSchema, checkpointSchema, checkKindSchema, type Checkpoint } from './limits';
import { freeText } from './free-text';
import type { Phrase } from '../i18n/phrase';

const typeCodeSchema = z
  .string()
  .trim()
  .regex(/^[A-Z0-9][A-Z0-9-]{0,31}$/, 'words:validation.typeCode');

/** A new type starts as a draft limits version; it is judged by nothing until published. */
export const createTypeSchema = z
  .object({
    code: typeCodeSchema,
    name: freeText('words:validation.field.typeName', {
      min: 1,
      minMessage: 'words:validation.typeName',
      max: 100,
    }),
    /** Optional starting definition (for example a copy of another type); code and name are taken from above. */
    definition: aircraftTypeDefinitionSchema.optional(),
  })
  .strict();
export type CreateType = z.infer<typeof createTypeSchema>;

/** A draft is saved whole: it only has to be well-formed, gaps and overlaps are refused at publication. */
export const saveDraftSchema = z.object({ definition: aircraftTypeDefinitionSchema }).strict();
export type SaveDraft = z.infer<typeof saveDraftSchema>;

export interface LimitsVersionSummary {
  id: number;
  version: number;
  status: 'draft' | 'published';
  publishedAt: string | null;
  publishedBy: string | null;
  createdAt: string;
}

export interface TypeSummary {
  id: number;
  code: string;
  name: string;
  current: LimitsVersionSummary | null;
  draft: LimitsVersionSummary | null;
  airframes: number;
}

export interface TypeDetail extends TypeSummary {
  versions: LimitsVersionSummary[];
}

export interface LimitsVersionDetail extends LimitsVersionSummary {
  typeId: number;
  definition: z.infer<typeof aircraftTypeDefinitionSchema>;
}

export interface PublicationProblem {
  checkpoint: string;
  kind: string;
  /** "sys1.level: No band covers …", written by the screen in its own language. */
  reason: Phrase;
  bands?: string[];
}

export interface FieldChange {
  field: string;
  from: unknown;
  to: unknown;
}

export interface CheckpointDiff {
  code: string;
  label: string;
  change: 'added' | 'removed' | 'changed';
  fields: FieldChange[];
  bands: { id: string; change: 'added' | 'removed' | 'changed'; fields: FieldChange[] }[];
  from: Checkpoint | null;
  to: Checkpoint | null;
}

export interface LimitsDiff {
  from: { id: number; version: number; status: string };
  to: { id: number; version: number; status: string };
  type: FieldChange[];
  cards: { kind: z.infer<typeof checkKindSchema>; from: string[]; to: string[] }[];
  checkpoints: CheckpointDiff[];
}

export const checkpointFormSchema = checkpointSchema;
