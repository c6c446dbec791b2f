import { z } from 'zod';
import { withValues, type FieldKey, type ValidationKey } from '../i18n/validation';

// Control characters other than tab and line feed (C0, DEL, C1): finding them is the point here.
// eslint-disable-next-line no-control-regex
const controlCharacter = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/;
// Bidi embeddings, overrides and isolates: text that reads differently from what is stored (UAX #9;
// CVE-2021-42574, "Trojan Source").
const bidiControl = /[\u202A-\u202E\u2066-\u2069]/;
// A surrogate without its partner is not a character (RFC 8259 section 8.2) and does not survive the database.
const loneSurrogate = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

const codePoint = (text: string, pattern: RegExp) => {
  const found = pattern.exec(text)?.[0] ?? '';
  return `U+${found.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`;
};

interface Length {
  max: number;
  /** A key whose {{max}} is filled with `max`: "A note is at most {{max}} characters." */
  maxMessage?: ValidationKey;
  min?: number;
  /** A key, or a key with its values (withValues): "Enter the name.", "The band message is missing." */
  minMessage?: string;
}

/**
 * Text a person types, as it is stored and signed: refused with a message when it holds a control character
 * other than tab and line feed, a bidi control or a lone surrogate; otherwise normalised to NFC (UAX #15), so
 * text that looks the same is stored the same, and trimmed. Every free-text field of the API uses this. `field`
 * names it in those messages ("The note holds a control character (U+0007); …"), in the reader's language.
 */
export function freeText(field: FieldKey, length: Length) {
  let checked = z
    .string()
    .max(length.max, length.maxMessage && withValues(length.maxMessage, { max: length.max }));
  if (length.min !== undefined) checked = checked.min(length.min, length.minMessage);
  return z
    .string()
    .superRefine((text, ctx) => {
      const problem = loneSurrogate.test(text)
        ? withValues('words:validation.freeText.brokenCharacter', {
            field,
            codePoint: codePoint(text, loneSurrogate),
          })
        : bidiControl.test(text)
          ? withValues('words:validation.freeText.directionControl', {
              field,
              codePoint: codePoint(text, bidiControl),
            })
          : controlCharacter.test(text)
            ? withValues('words:validation.freeText.controlCharacter', {
                field,
                codePoint: codePoint(text, controlCharacter),
              })
            : null;
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    })
    .transform((text) => text.normalize('NFC').trim())
    .pipe(checked);
}
