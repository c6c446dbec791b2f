import { Link, Navigate, Outlet, useNavigate, useOutletContext } from 'react-router-dom';
import type { SessionUser } from '@shared/schemas/auth';
import { roleLabels } from '@shared/schemas/plain';
import { useSession } from '@/features/auth/api/get-session';
import { useSignOut } from '@/features/auth/api/sign-out';
import { Button } from '@/components/ui/button';

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
    <div className="flex min-h-dvh flex-col bg-ink text-body text-paper">
      <header className="flex flex-wrap items-center gap-4 border-b-2 border-ink-line bg-ink-soft px-6 py-3">
        <Link to="/desk/home" className="mr-4 text-[30px] font-bold">
          Gaugewalk desk
        </Link>
        <nav className="flex flex-wrap gap-3" aria-label="Desk">
          <Link
            to="/board"
            className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-4 text-[22px] font-semibold"
          >
            Hangar board
          </Link>
          {(lead || engineering) && (
            <Link
              to="/desk/holds"
              className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-4 text-[22px] font-semibold"
            >
              Holds
            </Link>
          )}
          {(lead || engineering) && (
            <Link
              to="/desk/defects"
              className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-4 text-[22px] font-semibold"
            >
              Defects
            </Link>
          )}
          {(lead || engineering) && (
            <Link
              to="/desk/handover"
              className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-4 text-[22px] font-semibold"
            >
              Handover
            </Link>
          )}
          {engineering && (
            <Link
              to="/desk/devices"
              className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-4 text-[22px] font-semibold"
            >
              Tablets and TVs
            </Link>
          )}
        </nav>
        <span className="ml-auto text-[22px]" title={user.roles.map((role) => roleLabels[role]).join(', ')}>
          <strong>{user.name}</strong>
        </span>
        <Button
          tone="neutral"
          onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/desk', { replace: true }) })}
        >
          Sign out
        </Button>
      </header>
      <main className="flex flex-1 flex-col gap-6 px-6 py-6">
        <Outlet context={user} />
      </main>
    </div>
  );
}
