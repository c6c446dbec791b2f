import { KioskTablets } from '@/features/kiosks/components/kiosk-tablets';
import { BoardLinksPage } from '@/features/board-links/components/board-links-page';
import { Notice } from '@/components/ui/notice';
import { DeskPage } from '@/components/desk/desk-ui';
import { useDeskUser } from './desk-layout';

/** The devices engineering sets up for the hangar, kiosk tablets and TV board links, on one page. */
export function DeskDevicesRoute() {
  const user = useDeskUser();
  if (!user.roles.includes('engineering')) {
    return (
      <Notice tone="caution" title="Engineering only">
        Kiosk tablets and board links are enrolled and revoked by engineering.
      </Notice>
    );
  }
  return (
    <DeskPage title="Tablets and TVs">
      <KioskTablets />
      <BoardLinksPage />
    </DeskPage>
  );
}
