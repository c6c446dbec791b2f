import 'i18next';
import type { english } from '@shared/i18n/english';

// Keys are checked by the compiler: a t('...') with a key that the English catalogue lacks fails the typecheck.
declare module 'i18next' {
  interface CustomTypeOptions {
    defaultNS: 'common';
    resources: typeof english;
  }
}
