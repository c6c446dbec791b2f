import type { ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
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

// Where these screens lead; addresses, not words.
const kioskAirframes = '/kiosk/airframes';
// Codes the components below take, not words.
const channels = { desk: 'desk', kiosk: 'kiosk' } as const satisfies Record<SigningChannel, SigningChannel>;
const audience = { leads: 'leads', engineering: 'engineering' } as const;
const kioskHolds = '/kiosk/holds';
const techLogBase = { desk: '/desk/defects', kiosk: '/kiosk/defects' } as const;
const holdsBase = { desk: '/desk/holds', kiosk: '/kiosk/holds' } as const;

const deskBackLink =
  'inline-flex h-10 items-center self-start rounded-lg border-2 border-ink-line bg-ink-raised px-4 text-[17px] font-semibold';
const backLink =
  'inline-flex min-h-touch items-center self-start rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold';

// Whom each desk page is for, with the catalogue keys (namespace app) that say so to anyone else.
const audiences = {
  leads: {
    only: 'audiences.leads.only',
    forWhom: 'audiences.leads.forWhom',
    allowed: (roles: Role[]) => roles.includes('shift_lead') || roles.includes('engineering'),
  },
  engineering: {
    only: 'audiences.engineering.only',
    forWhom: 'audiences.engineering.forWhom',
    allowed: (roles: Role[]) => roles.includes('engineering'),
  },
} as const;

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
  const { t } = useTranslation('app');
  const { only, forWhom, allowed } = audiences[audience];
  if (!allowed(user.roles))
    return (
      <Notice tone="caution" title={t(only)}>
        {t(forWhom)}
      </Notice>
    );
  return <DeskPage title={title}>{children}</DeskPage>;
}

export function DeskHoldsRoute() {
  const { t } = useTranslation('app');
  return (
    <DeskPageFor audience={audience.leads} title={t('holds.title')}>
      <HoldsQueue hrefFor={(id) => `/desk/holds/${id}`} />
    </DeskPageFor>
  );
}

export function DeskHoldRoute() {
  const user = useDeskUser();
  const holdId = Number(useParams().holdId);
  const { t } = useTranslation('app');
  return (
    <>
      <Link to="/desk/holds" className={deskBackLink}>
        {t('holds.all')}
      </Link>
      <HoldDetailView
        holdId={holdId}
        channel={channels.desk}
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
  const { t } = useTranslation('app');
  return (
    <PageShell
      title={title}
      eyebrow={t('kioskEyebrow', { name: session.kiosk.name })}
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
  const { t } = useTranslation('app');
  if (airframes.isPending) return <p className="text-lead text-ink-muted">{t('techLog.loading')}</p>;
  if (airframes.isError)
    return (
      <Notice tone="warning" title={t('techLog.notLoaded')}>
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
      holdHref={(holdId) => `${holdsBase[channel]}/${holdId}`}
      now={airframes.dataUpdatedAt}
    />
  );
}

export function DeskDefectsRoute() {
  const user = useDeskUser();
  const { t } = useTranslation('app');
  return (
    <DeskPageFor audience={audience.leads} title={t('home.defects.title')}>
      <OpenDraftsPanel canClose={user.roles.includes('shift_lead')} />
      <TechLog channel={channels.desk} roles={user.roles} base={techLogBase.desk} />
    </DeskPageFor>
  );
}

/** The tech log on a hangar tablet: the same acts, signed with the PIN on the keypad. */
export function KioskDefectsRoute() {
  const session = useKioskSession();
  const { t } = useTranslation('app');
  if (!maintains(session.user.roles)) return <Navigate to="/pilot" replace />;
  return (
    <KioskPage
      session={session}
      title={t('airframes.techLog')}
      back={{ to: kioskAirframes, label: t('airframes.title') }}
    >
      <TechLog channel={channels.kiosk} roles={session.user.roles} base={techLogBase.kiosk} />
    </KioskPage>
  );
}

export function DeskHandoverRoute() {
  const user = useDeskUser();
  const { t } = useTranslation('app');
  return (
    <DeskPageFor audience={audience.leads} title={t('home.handover.title')}>
      <HandoverPage canSend={user.roles.includes('shift_lead')} />
    </DeskPageFor>
  );
}

export function DeskMailRoute() {
  const { t } = useTranslation('app');
  return (
    <DeskPageFor audience={audience.engineering} title={t('home.mail.title')}>
      <MailOutbox />
    </DeskPageFor>
  );
}

/** A shift lead on a hangar tablet: the same queue, countersigned with the PIN on the keypad. */
export function KioskHoldsRoute() {
  const session = useKioskSession();
  const { t } = useTranslation('app');
  if (!session.user.roles.includes('shift_lead')) return <Navigate to="/kiosk/airframes" replace />;
  return (
    <KioskPage
      session={session}
      title={t('holds.title')}
      back={{ to: kioskAirframes, label: t('airframes.title') }}
    >
      <HoldsQueue hrefFor={(id) => `/kiosk/holds/${id}`} />
    </KioskPage>
  );
}

export function KioskHoldRoute() {
  const session = useKioskSession();
  const holdId = Number(useParams().holdId);
  const { t } = useTranslation('app');
  if (!maintains(session.user.roles)) return <Navigate to="/kiosk/airframes" replace />;
  const lead = session.user.roles.includes('shift_lead');
  return (
    <KioskPage
      session={session}
      title={t('holds.one')}
      back={
        lead ? { to: kioskHolds, label: t('holds.all') } : { to: kioskAirframes, label: t('airframes.title') }
      }
    >
      <HoldDetailView
        holdId={holdId}
        channel={channels.kiosk}
        userId={session.user.id}
        canCountersign={lead}
      />
    </KioskPage>
  );
}
