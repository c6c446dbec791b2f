import type { ReactNode } from 'react';
import { Link, Navigate, useParams } from 'react-router-dom';
import type { Role } from '@shared/schemas/auth';
import { useAirframes } from '@/lib/shared-queries';
import { OpenDraftsPanel } from '@/features/checks/components/open-drafts-panel';
import { TechLogPage } from '@/features/defects/components/tech-log-page';
import type { SigningChannel } from '@/components/ui/signature-entry';
import { errorMessage } from '@/lib/api-client';
import { HoldsQueue } from '@/features/holds/components/holds-queue';
import { HoldDetailView } from '@/features/holds/components/hold-detail';
import { HandoverPage } from '@/features/handover/components/handover-page';
import { MailOutbox } from '@/features/mail/components/mail-outbox';
import { Notice } from '@/components/ui/notice';
import { PageShell } from '@/components/ui/page-shell';
import { DeskPage } from '@/components/desk/desk-ui';
import { useDeskUser } from './desk-layout';
import { KioskUserActions, useKioskSession } from './kiosk-layout';

const deskBackLink =
  'inline-flex h-10 items-center self-start rounded-lg border-2 border-ink-line bg-ink-raised px-4 text-[17px] font-semibold';
const backLink =
  'inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold';

const audiences = {
  leads: {
    who: 'Shift leads and engineering',
    allowed: (roles: Role[]) => roles.includes('shift_lead') || roles.includes('engineering'),
  },
  engineering: { who: 'Engineering', allowed: (roles: Role[]) => roles.includes('engineering') },
};

/** A desk page for one audience; anyone else is told whom it is for. */
function DeskPageFor({
  audience,
  title,
  children,
}: {
  audience: keyof typeof audiences;
  title: string;
  children: ReactNode;
}) {
  const user = useDeskUser();
  const { who, allowed } = audiences[audience];
  if (!allowed(user.roles))
    return (
      <Notice tone="caution" title={`${who} only`}>
        This page is for {who.toLowerCase()}.
      </Notice>
    );
  return <DeskPage title={title}>{children}</DeskPage>;
}

export function DeskHoldsRoute() {
  return (
    <DeskPageFor audience="leads" title="Holds, oldest first">
      <HoldsQueue hrefFor={(id) => `/desk/holds/${id}`} />
    </DeskPageFor>
  );
}

export function DeskHoldRoute() {
  const user = useDeskUser();
  const holdId = Number(useParams().holdId);
  return (
    <>
      <Link to="/desk/holds" className={deskBackLink}>
        All holds
      </Link>
      <HoldDetailView
        holdId={holdId}
        channel="desk"
        userId={user.id}
        canCountersign={user.roles.includes('shift_lead')}
      />
    </>
  );
}

/** A kiosk screen of this module: the kiosk frame, a way back, then the content. */
function KioskPage({
  session,
  title,
  back,
  children,
}: {
  session: ReturnType<typeof useKioskSession>;
  title: string;
  back: { to: string; label: string };
  children: ReactNode;
}) {
  return (
    <PageShell
      title={title}
      eyebrow={`Kiosk · ${session.kiosk.name}`}
      actions={<KioskUserActions session={session} />}
      showsLimits
    >
      <div className="flex flex-col gap-5">
        <Link to={back.to} className={backLink}>
          {back.label}
        </Link>
        {children}
      </div>
    </PageShell>
  );
}

/** Who may sign tech-log acts and releases (the server checks the authorisation behind each signature). */
const maintains = (roles: Role[]) => roles.includes('shift_lead') || roles.includes('mechanic');

function TechLog({ channel, roles, base }: { channel: SigningChannel; roles: Role[]; base: string }) {
  const airframes = useAirframes();
  const id = useParams().airframeId;
  if (airframes.isPending) return <p className="text-lead text-ink-muted">Loading the fleet…</p>;
  if (airframes.isError)
    return (
      <Notice tone="warning" title="The fleet did not load">
        {errorMessage(airframes.error)}
      </Notice>
    );
  return (
    <TechLogPage
      airframes={airframes.data}
      selectedId={id ? Number(id) : null}
      hrefFor={(airframeId) => `${base}/${airframeId}`}
      listHref={base}
      channel={channel}
      canAct={maintains(roles)}
      holdHref={(holdId) => `${channel === 'desk' ? '/desk' : '/kiosk'}/holds/${holdId}`}
      now={airframes.dataUpdatedAt}
    />
  );
}

export function DeskDefectsRoute() {
  const user = useDeskUser();
  return (
    <DeskPageFor audience="leads" title="Defects and releases">
      <OpenDraftsPanel canClose={user.roles.includes('shift_lead')} />
      <TechLog channel="desk" roles={user.roles} base="/desk/defects" />
    </DeskPageFor>
  );
}

/** The tech log on a hangar tablet: the same acts, signed with the PIN on the keypad. */
export function KioskDefectsRoute() {
  const session = useKioskSession();
  if (!maintains(session.user.roles)) return <Navigate to="/pilot" replace />;
  return (
    <KioskPage session={session} title="Tech log" back={{ to: '/kiosk/airframes', label: 'Airframes' }}>
      <TechLog channel="kiosk" roles={session.user.roles} base="/kiosk/defects" />
    </KioskPage>
  );
}

export function DeskHandoverRoute() {
  const user = useDeskUser();
  return (
    <DeskPageFor audience="leads" title="Shift handover">
      <HandoverPage canSend={user.roles.includes('shift_lead')} />
    </DeskPageFor>
  );
}

export function DeskMailRoute() {
  return (
    <DeskPageFor audience="engineering" title="Mail outbox">
      <MailOutbox />
    </DeskPageFor>
  );
}

/** A shift lead on a hangar tablet: the same queue, countersigned with the PIN on the keypad. */
export function KioskHoldsRoute() {
  const session = useKioskSession();
  if (!session.user.roles.includes('shift_lead')) return <Navigate to="/kiosk/airframes" replace />;
  return (
    <KioskPage
      session={session}
      title="Holds, oldest first"
      back={{ to: '/kiosk/airframes', label: 'Airframes' }}
    >
      <HoldsQueue hrefFor={(id) => `/kiosk/holds/${id}`} />
    </KioskPage>
  );
}

export function KioskHoldRoute() {
  const session = useKioskSession();
  const holdId = Number(useParams().holdId);
  if (!maintains(session.user.roles)) return <Navigate to="/kiosk/airframes" replace />;
  const lead = session.user.roles.includes('shift_lead');
  return (
    <KioskPage
      session={session}
      title="Hold"
      back={
        lead ? { to: '/kiosk/holds', label: 'All holds' } : { to: '/kiosk/airframes', label: 'Airframes' }
      }
    >
      <HoldDetailView holdId={holdId} channel="kiosk" userId={session.user.id} canCountersign={lead} />
    </KioskPage>
  );
}
