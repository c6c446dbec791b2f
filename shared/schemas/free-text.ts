import { z } from 'zod';

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
  maxMessage?: string;
  min?: number;
  minMessage?: string;
}

/**
 * Text a person types, as it is stored and signed: refused with a message when it holds a control character
 * other than tab and line feed, a bidi control or a lone surrogate; otherwise normalised to NFC (UAX #15), so
 * text that looks the same is stored the same, and trimmed. Every free-text field of the API uses this.
 */
export function freeText(what: string, length: Length) {
  let checked = z.string().max(length.max, length.maxMessage);
  if (length.min !== undefined) checked = checked.min(length.min, length.minMessage);
  return z
    .string()
    .superRefine((text, ctx) => {
      const problem = loneSurrogate.test(text)
        ? `holds a broken character (${codePoint(text, loneSurrogate)})`
        : bidiControl.test(text)
          ? `holds a text-direction control (${codePoint(text, bidiControl)}), which can hide what it says`
          : controlCharacter.test(text)
            ? `holds a control character (${codePoint(text, controlCharacter)}); only line breaks and tabs are allowed`
            : null;
      if (problem) ctx.addIssue({ code: 'custom', message: `${what} ${problem}.` });
    })
    .transform((text) => text.normalize('NFC').trim())
    .pipe(checked);
}
