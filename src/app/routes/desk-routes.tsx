import { lazy, Suspense } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, Navigate, useNavigate } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { PageShell } from '@/components/ui/page-shell';
import { DeskPage } from '@/components/desk/desk-ui';
import type { Role } from '@shared/schemas/auth';
import { useDeskUser } from './desk-layout';

// The form library and the schemas come with the sign-in form only: a desk that is signed in goes on to its home
// page without them.
const DeskSignInForm = lazy(() =>
  import('@/features/auth/components/desk-sign-in-form').then((m) => ({ default: m.DeskSignInForm })),
);

const deskHomePath = '/desk/home';

export function DeskSignInRoute() {
  const session = useSession();
  const navigate = useNavigate();
  const { t } = useTranslation('app');
  // Wait for the session before drawing the form, so a signed-in desk never fetches the form's code.
  if (session.isPending) return <p className="p-6 text-lead">{t('loading')}</p>;
  if (session.data?.user && session.data.channel === 'desk') return <Navigate to="/desk/home" replace />;
  return (
    <PageShell title={t('deskSignIn')} eyebrow={t('leadsAndEngineering')} kiosk={false}>
      <div className="flex flex-col gap-5">
        <p className="text-lead text-ink-muted">{t('deskSignInPage.mechanicsHint')}</p>
        <Suspense fallback={<p className="text-lead">{t('loading')}</p>}>
          <DeskSignInForm onSignedIn={() => void navigate(deskHomePath, { replace: true })} />
        </Suspense>
        <Link to="/" className="text-[22px] underline">
          {t('backToStart')}
        </Link>
      </div>
    </PageShell>
  );
}

type Who = 'everyone' | 'leads and engineering' | 'engineering';
// Each card's title and line are catalogue keys (namespace app), read at render.
const homeCards = [
  { to: '/board', title: 'home.board.title', what: 'home.board.what', who: 'everyone' },
  { to: '/desk/holds', title: 'home.holds.title', what: 'home.holds.what', who: 'leads and engineering' },
  {
    to: '/desk/defects',
    title: 'home.defects.title',
    what: 'home.defects.what',
    who: 'leads and engineering',
  },
  {
    to: '/desk/handover',
    title: 'home.handover.title',
    what: 'home.handover.what',
    who: 'leads and engineering',
  },
  { to: '/desk/mail', title: 'home.mail.title', what: 'home.mail.what', who: 'engineering' },
  {
    to: '/desk/records',
    title: 'home.records.title',
    what: 'home.records.what',
    who: 'leads and engineering',
  },
  { to: '/desk/trends', title: 'home.trends.title', what: 'home.trends.what', who: 'leads and engineering' },
  { to: '/desk/types', title: 'home.types.title', what: 'home.types.what', who: 'engineering' },
  { to: '/desk/fleet', title: 'home.fleet.title', what: 'home.fleet.what', who: 'engineering' },
  { to: '/desk/tools', title: 'home.tools.title', what: 'home.tools.what', who: 'engineering' },
  { to: '/desk/staff', title: 'home.staff.title', what: 'home.staff.what', who: 'engineering' },
  { to: '/desk/devices', title: 'home.devices.title', what: 'home.devices.what', who: 'engineering' },
  { to: '/desk/audit', title: 'home.audit.title', what: 'home.audit.what', who: 'engineering' },
] as const satisfies readonly { to: string; title: string; what: string; who: Who }[];

const sees = (roles: Role[], who: Who) =>
  who === 'everyone' ||
  roles.includes('engineering') ||
  (who === 'leads and engineering' && roles.includes('shift_lead'));

export function DeskHomeRoute() {
  const user = useDeskUser();
  const { t } = useTranslation('app');
  return (
    <DeskPage title={t('home.greeting', { name: user.name.split(' ')[0] })}>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {homeCards
          .filter((card) => sees(user.roles, card.who))
          .map((card) => (
            <Link
              key={card.to}
              to={card.to}
              className="flex min-h-[104px] flex-col justify-end gap-1 rounded-xl border-2 border-ink-line bg-ink-soft p-4 hover:border-signal-edge"
            >
              <span className="text-[22px] font-bold">{t(card.title)}</span>
              <span className="text-[16px] text-ink-muted">{t(card.what)}</span>
            </Link>
          ))}
      </div>
    </DeskPage>
  );
}
