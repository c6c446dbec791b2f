// The German catalogue, one JSON file per namespace, for tests that read screens against it.
import type { Namespace } from '@shared/i18n/english';
import common from '@shared/i18n/locales/de/common.json';
import app from '@shared/i18n/locales/de/app.json';
import auth from '@shared/i18n/locales/de/auth.json';
import kiosks from '@shared/i18n/locales/de/kiosks.json';
import airframes from '@shared/i18n/locales/de/airframes.json';
import checks from '@shared/i18n/locales/de/checks.json';
import acceptance from '@shared/i18n/locales/de/acceptance.json';
import engineeringTypes from '@shared/i18n/locales/de/engineeringTypes.json';
import staff from '@shared/i18n/locales/de/staff.json';
import fleet from '@shared/i18n/locales/de/fleet.json';
import tools from '@shared/i18n/locales/de/tools.json';
import records from '@shared/i18n/locales/de/records.json';
import boardLinks from '@shared/i18n/locales/de/boardLinks.json';
import mail from '@shared/i18n/locales/de/mail.json';
import board from '@shared/i18n/locales/de/board.json';
import handover from '@shared/i18n/locales/de/handover.json';
import holds from '@shared/i18n/locales/de/holds.json';
import defects from '@shared/i18n/locales/de/defects.json';
import words from '@shared/i18n/locales/de/words.json';
import email from '@shared/i18n/locales/de/email.json';
import pdf from '@shared/i18n/locales/de/pdf.json';
import csv from '@shared/i18n/locales/de/csv.json';

const german: Record<Namespace, unknown> = {
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
};

export default german;
