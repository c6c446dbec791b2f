import { useTranslation } from 'react-i18next';
import { KioskTablets } from '@/features/kiosks/components/kiosk-tablets';
import { BoardLinksPage } from '@/features/board-links/components/board-links-page';
import { Notice } from '@/components/ui/notice';
import { DeskPage } from '@/components/desk/desk-ui';
import { useDeskUser } from './desk-layout';

/** The devices engineering sets up for the hangar, kiosk tablets and TV board links, on one page. */
export function DeskDevicesRoute() {
  const user = useDeskUser();
  const { t } = useTranslation('app');
  if (!user.roles.includes('engineering')) {
    return (
      <Notice tone="caution" title={t('audiences.engineering.only')}>
        {t('devices.engineeringOnlyText')}
      </Notice>
    );
  }
  return (
    <DeskPage title={t('tabletsAndTvs')}>
      <KioskTablets />
      <BoardLinksPage />
    </DeskPage>
  );
}
