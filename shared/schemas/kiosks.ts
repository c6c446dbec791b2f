import { z } from 'zod';
import { freeText } from './free-text';
import { baseCodeSchema } from './board-links';

export const kioskRenameSchema = z
  .object({
    name: freeText('words:validation.field.tabletName', {
      min: 1,
      minMessage: 'words:validation.tabletName',
      max: 100,
    }),
  })
  .strict();

/** A new tablet: its name and, optionally, the base it stands at (its airframe list shows that base first). */
export const kioskCreateSchema = kioskRenameSchema.extend({ base: baseCodeSchema.optional() }).strict();

/** Moving a tablet to another base; null takes it off any base. */
export const kioskPlaceSchema = z.object({ base: baseCodeSchema.nullable() }).strict();
