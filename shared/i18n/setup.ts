import type { InitOptions } from 'i18next';
import { languages, sourceLanguage } from './languages';

// What every i18next instance here shares, the screens' (src/i18n/i18n.ts) and the server's
// (server/i18n/translator.ts): the namespaces, one per area, and how a language is picked and text is written.

export const namespaces = [
  'common',
  'app',
  'auth',
  'kiosks',
  'airframes',
  'checks',
  'acceptance',
  'engineeringTypes',
  'staff',
  'fleet',
  'tools',
  'records',
  'boardLinks',
  'mail',
  'board',
  'handover',
  'holds',
  'defects',
  'words',
  'email',
  'pdf',
  'csv',
  'refusals',
] as const;
export type Namespace = (typeof namespaces)[number];

export const sharedOptions = {
  supportedLngs: [...languages],
  nonExplicitSupportedLngs: true,
  load: 'languageOnly',
  fallbackLng: sourceLanguage,
  defaultNS: 'common',
  interpolation: { escapeValue: false },
} satisfies InitOptions;
