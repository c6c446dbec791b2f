import { useTranslation } from 'react-i18next';
import { Link, Navigate, Outlet, useNavigate, useOutletContext } from 'react-router-dom';
import type { SessionUser } from '@shared/schemas/auth';
import { useSession } from '@/features/auth/api/get-session';
import { useSignOut } from '@/features/auth/api/sign-out';
import { Button } from '@/components/ui/button';
import { DensityProvider } from '@/components/ui/density';
import { roleLabel } from '@shared/schemas/plain';

// Labels are catalogue keys (namespace app), read at render in the signed-in person's language.
const deskNav = [
  { to: '/board', label: 'hangarBoard', for: () => true },
  {
    to: '/desk/holds',
    label: 'deskNav.holds',
    for: (lead: boolean, engineering: boolean) => lead || engineering,
  },
  {
    to: '/desk/defects',
    label: 'deskNav.defects',
    for: (lead: boolean, engineering: boolean) => lead || engineering,
  },
  {
    to: '/desk/handover',
    label: 'deskNav.handover',
    for: (lead: boolean, engineering: boolean) => lead || engineering,
  },
  { to: '/desk/devices', label: 'tabletsAndTvs', for: (_lead: boolean, engineering: boolean) => engineering },
] as const;

const deskSignInPath = '/desk';
const deskDensity = 'desk' as const;

export const useDeskUser = () => useOutletContext<SessionUser>();

export function DeskLayout() {
  const session = useSession();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const { t } = useTranslation('app');
  if (session.isPending) return <p className="p-6 text-lead">{t('loading')}</p>;
  const user = session.data?.user;
  if (!user || session.data?.channel !== 'desk') return <Navigate to="/desk" replace />;
  const engineering = user.roles.includes('engineering');
  const lead = user.roles.includes('shift_lead');
  return (
    <DensityProvider value={deskDensity}>
      <div className="flex min-h-dvh flex-col bg-ink text-body text-paper">
        <header className="flex flex-wrap items-center gap-3 border-b-2 border-ink-line bg-ink-soft px-6 py-2">
          <Link to="/desk/home" className="mr-3 whitespace-nowrap text-[24px] font-bold">
            {t('deskHeader.home')}
          </Link>
          <nav className="flex flex-wrap gap-2" aria-label={t('deskHeader.navLabel')}>
            {deskNav
              .filter((item) => item.for(lead, engineering))
              .map((item) => (
                <Link
                  key={item.to}
                  to={item.to}
                  className="inline-flex h-10 items-center whitespace-nowrap rounded-lg border-2 border-ink-line bg-ink-raised px-3 text-[17px] font-semibold"
                >
                  {t(item.label)}
                </Link>
              ))}
          </nav>
          <span
            className="ml-auto whitespace-nowrap text-[17px]"
            title={user.roles.map((role) => roleLabel(role)).join(', ')}
          >
            <strong>{user.name}</strong>
          </span>
          <Button
            tone="neutral"
            onClick={() =>
              signOut.mutate(undefined, { onSettled: () => void navigate(deskSignInPath, { replace: true }) })
            }
          >
            {t('signOut')}
          </Button>
        </header>
        <main className="flex flex-1 flex-col gap-6 px-6 py-6 text-[17px]">
          <Outlet context={user} />
        </main>
      </div>
    </DensityProvider>
  );
}
