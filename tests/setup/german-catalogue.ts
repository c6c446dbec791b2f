// The German catalogue, every namespace, for tests that read screens against it.
import { readCatalogue } from '@server/i18n/translator';
import type { Namespace } from '@shared/i18n/setup';

const german = readCatalogue('de') as Record<Namespace, unknown>;

export default german;
