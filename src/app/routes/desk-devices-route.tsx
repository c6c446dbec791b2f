import { useTranslation } from 'react-i18next';
import { KioskTablets } from '@/features/kiosks/components/kiosk-tablets';
import { BoardLinksPage } from '@/features/board-links/components/board-links-page';
import { Notice } from '@/components/ui/notice';
import { DeskPage } from '@/components/desk/desk-ui';
import { useQuery } from '@tanstack/react-query';
import { basesQueryOptions } from '@/features/fleet/api/fleet';
import { useDeskUser } from './desk-layout';

/** The devices engineering sets up for the hangar, kiosk tablets and TV board links, on one page. */
export function DeskDevicesRoute() {
  const user = useDeskUser();
  const { t } = useTranslation('app');
  // The fleet's bases, for choosing where a tablet stands and which bases a TV shows.
  const bases = useQuery({ ...basesQueryOptions(), enabled: user.roles.includes('engineering') });
  if (!user.roles.includes('engineering')) {
    return (
      <Notice tone="caution" title={t('audiences.engineering.only')}>
        {t('devices.engineeringOnlyText')}
      </Notice>
    );
  }
  return (
    <DeskPage title={t('tabletsAndTvs')}>
      <KioskTablets bases={bases.data ?? []} />
      <BoardLinksPage bases={bases.data ?? []} />
    </DeskPage>
  );
}
