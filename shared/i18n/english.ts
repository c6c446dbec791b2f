// The English catalogue, one JSON file per namespace, for the server, the tests and the compiler's key types. English
// is the source language: every other language has exactly these keys (shared/i18n/catalogue.test.ts). Screens do
// not import this file: they load each namespace with the screens that use it (src/i18n/i18n.ts).
import common from './locales/en/common.json';
import app from './locales/en/app.json';
import auth from './locales/en/auth.json';
import kiosks from './locales/en/kiosks.json';
import airframes from './locales/en/airframes.json';
import checks from './locales/en/checks.json';
import acceptance from './locales/en/acceptance.json';
import engineeringTypes from './locales/en/engineeringTypes.json';
import staff from './locales/en/staff.json';
import fleet from './locales/en/fleet.json';
import tools from './locales/en/tools.json';
import records from './locales/en/records.json';
import boardLinks from './locales/en/boardLinks.json';
import mail from './locales/en/mail.json';
import board from './locales/en/board.json';
import handover from './locales/en/handover.json';
import holds from './locales/en/holds.json';
import defects from './locales/en/defects.json';
import words from './locales/en/words.json';
import email from './locales/en/email.json';
import pdf from './locales/en/pdf.json';
import csv from './locales/en/csv.json';
import refusals from './locales/en/refusals.json';

import type { Namespace } from './setup';

export const english = {
  common,
  app,
  auth,
  kiosks,
  airframes,
  checks,
  acceptance,
  engineeringTypes,
  staff,
  fleet,
  tools,
  records,
  boardLinks,
  mail,
  board,
  handover,
  holds,
  defects,
  words,
  email,
  pdf,
  csv,
  refusals,
} satisfies Record<Namespace, unknown>;
