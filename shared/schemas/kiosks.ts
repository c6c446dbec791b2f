import { z } from 'zod';
import { freeText } from './free-text';

export const kioskRenameSchema = z
  .object({ name: freeText('The tablet name', { min: 1, minMessage: 'Give the tablet a name.', max: 100 }) })
  .strict();
