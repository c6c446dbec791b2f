import type { ReactNode } from 'react';
import { Link, Navigate, useParams } from 'react-router-dom';
import { HoldsQueue } from '../../features/holds/components/holds-queue';
import { HoldDetailView } from '../../features/holds/components/hold-detail';
import { HandoverPage } from '../../features/handover/components/handover-page';
import { MailOutbox } from '../../features/mail/components/mail-outbox';
import { Notice } from '../../components/ui/notice';
import { PageShell } from '../../components/ui/page-shell';
import { useDeskUser } from './desk-layout';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

const backLink =
  'inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold';

function Only({ allowed, who, children }: { allowed: boolean; who: string; children: ReactNode }) {
  if (!allowed)
    return (
      <Notice tone="caution" title={`${who} only`}>
        This page is for {who.toLowerCase()}.
      </Notice>
    );
  return <>{children}</>;
}

export function DeskHoldsRoute() {
  const user = useDeskUser();
  return (
    <Only
      allowed={user.roles.includes('shift_lead') || user.roles.includes('engineering')}
      who="Shift leads and engineering"
    >
      <h1 className="text-[40px] font-bold">Holds, oldest first</h1>
      <HoldsQueue hrefFor={(id) => `/desk/holds/${id}`} />
    </Only>
  );
}

export function DeskHoldRoute() {
  const user = useDeskUser();
  const holdId = Number(useParams().holdId);
  return (
    <>
      <Link to="/desk/holds" className={backLink}>
        All holds
      </Link>
      <HoldDetailView holdId={holdId} channel="desk" userId={user.id} />
    </>
  );
}

export function DeskHandoverRoute() {
  const user = useDeskUser();
  return (
    <Only
      allowed={user.roles.includes('shift_lead') || user.roles.includes('engineering')}
      who="Shift leads and engineering"
    >
      <h1 className="text-[40px] font-bold">Shift handover</h1>
      <HandoverPage canSend={user.roles.includes('shift_lead')} />
    </Only>
  );
}

export function DeskMailRoute() {
  const user = useDeskUser();
  return (
    <Only allowed={user.roles.includes('engineering')} who="Engineering">
      <h1 className="text-[40px] font-bold">Mail outbox</h1>
      <MailOutbox />
    </Only>
  );
}

/** A shift lead on a hangar tablet: the same queue, countersigned with the PIN on the keypad. */
export function KioskHoldsRoute() {
  const session = useKioskSession();
  if (!session.user.roles.includes('shift_lead')) return <Navigate to="/kiosk/airframes" replace />;
  return (
    <PageShell
      title="Holds, oldest first"
      eyebrow={`Kiosk · ${session.kiosk.name}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="flex flex-col gap-5">
        <Link to="/kiosk/airframes" className={backLink}>
          Airframes
        </Link>
        <HoldsQueue hrefFor={(id) => `/kiosk/holds/${id}`} />
      </div>
    </PageShell>
  );
}

export function KioskHoldRoute() {
  const session = useKioskSession();
  const holdId = Number(useParams().holdId);
  if (!session.user.roles.includes('shift_lead')) return <Navigate to="/kiosk/airframes" replace />;
  return (
    <PageShell
      title="Hold"
      eyebrow={`Kiosk · ${session.kiosk.name}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="flex flex-col gap-5">
        <Link to="/kiosk/holds" className={backLink}>
          All holds
        </Link>
        <HoldDetailView holdId={holdId} channel="kiosk" userId={session.user.id} />
      </div>
    </PageShell>
  );
}
