import { Link, Navigate, Outlet, useNavigate, useOutletContext } from 'react-router-dom';
import type { SessionUser } from '@shared/schemas/auth';
import { roleLabels } from '@shared/schemas/plain';
import { useSession } from '@/features/auth/api/get-session';
import { useSignOut } from '@/features/auth/api/sign-out';
import { Button } from '@/components/ui/button';
import { DensityProvider } from '@/components/ui/density';

const deskNav: { to: string; label: string; for: (lead: boolean, engineering: boolean) => boolean }[] = [
  { to: '/board', label: 'Hangar board', for: () => true },
  { to: '/desk/holds', label: 'Holds', for: (lead, engineering) => lead || engineering },
  { to: '/desk/defects', label: 'Defects', for: (lead, engineering) => lead || engineering },
  { to: '/desk/handover', label: 'Handover', for: (lead, engineering) => lead || engineering },
  { to: '/desk/devices', label: 'Tablets and TVs', for: (_lead, engineering) => engineering },
];

export const useDeskUser = () => useOutletContext<SessionUser>();

export function DeskLayout() {
  const session = useSession();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (session.isPending) return <p className="p-6 text-lead">Loading…</p>;
  const user = session.data?.user;
  if (!user || session.data?.channel !== 'desk') return <Navigate to="/desk" replace />;
  const engineering = user.roles.includes('engineering');
  const lead = user.roles.includes('shift_lead');
  return (
    <DensityProvider value="desk">
      <div className="flex min-h-dvh flex-col bg-ink text-body text-paper">
        <header className="flex items-center gap-3 border-b-2 border-ink-line bg-ink-soft px-6 py-2">
          <Link to="/desk/home" className="mr-3 whitespace-nowrap text-[24px] font-bold">
            Gaugewalk desk
          </Link>
          <nav className="flex gap-2" aria-label="Desk">
            {deskNav
              .filter((item) => item.for(lead, engineering))
              .map((item) => (
                <Link
                  key={item.to}
                  to={item.to}
                  className="inline-flex h-10 items-center whitespace-nowrap rounded-lg border-2 border-ink-line bg-ink-raised px-3 text-[17px] font-semibold"
                >
                  {item.label}
                </Link>
              ))}
          </nav>
          <span
            className="ml-auto whitespace-nowrap text-[17px]"
            title={user.roles.map((role) => roleLabels[role]).join(', ')}
          >
            <strong>{user.name}</strong>
          </span>
          <Button
            tone="neutral"
            onClick={() =>
              signOut.mutate(undefined, { onSettled: () => navigate('/desk', { replace: true }) })
            }
          >
            Sign out
          </Button>
        </header>
        <main className="flex flex-1 flex-col gap-6 px-6 py-6 text-[17px]">
          <Outlet context={user} />
        </main>
      </div>
    </DensityProvider>
  );
}
