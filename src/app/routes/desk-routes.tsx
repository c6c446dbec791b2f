import { lazy, Suspense } from 'react';
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

export function DeskSignInRoute() {
  const session = useSession();
  const navigate = useNavigate();
  // Wait for the session before drawing the form, so a signed-in desk never fetches the form's code.
  if (session.isPending) return <p className="p-6 text-lead">Loading…</p>;
  if (session.data?.user && session.data.channel === 'desk') return <Navigate to="/desk/home" replace />;
  return (
    <PageShell title="Desk sign-in" eyebrow="Shift leads and engineering">
      <div className="flex flex-col gap-5">
        <p className="text-lead text-ink-muted">Mechanics sign in at a kiosk tablet with badge and PIN.</p>
        <Suspense fallback={<p className="text-lead">Loading…</p>}>
          <DeskSignInForm onSignedIn={() => void navigate('/desk/home', { replace: true })} />
        </Suspense>
        <Link to="/" className="text-[22px] underline">
          Back to start
        </Link>
      </div>
    </PageShell>
  );
}

type Who = 'everyone' | 'leads and engineering' | 'engineering';
const homeCards: { to: string; title: string; what: string; who: Who }[] = [
  { to: '/board', title: 'Hangar board', what: 'Every airframe, unserviceable first, live', who: 'everyone' },
  {
    to: '/desk/holds',
    title: 'Holds',
    what: 'Review, record the corrective action, countersign and release',
    who: 'leads and engineering',
  },
  {
    to: '/desk/defects',
    title: 'Defects and releases',
    what: 'The tech log per airframe: rectify, defer, certify, release to service; checks left open',
    who: 'leads and engineering',
  },
  {
    to: '/desk/handover',
    title: 'Shift handover',
    what: "The shift's checks, holds and fluid, sent by e-mail",
    who: 'leads and engineering',
  },
  {
    to: '/desk/mail',
    title: 'Mail outbox',
    what: 'What the hold and handover e-mails said',
    who: 'engineering',
  },
  {
    to: '/desk/records',
    title: 'Records',
    what: 'Search signed checks, open the full record, export CSV',
    who: 'leads and engineering',
  },
  {
    to: '/desk/trends',
    title: 'Fluid trends',
    what: 'Levels and fluid added per flight hour, with the alert line',
    who: 'leads and engineering',
  },
  {
    to: '/desk/types',
    title: 'Types and limits',
    what: 'Check cards and limit bands, drafted and published as versions',
    who: 'engineering',
  },
  {
    to: '/desk/fleet',
    title: 'Airframes and tags',
    what: 'Add airframes, print and reissue QR tags',
    who: 'engineering',
  },
  {
    to: '/desk/tools',
    title: 'Tools and calibration',
    what: 'Gauges, nitrogen charging kits and servicing carts, their calibration dates and QR tags',
    who: 'engineering',
  },
  {
    to: '/desk/staff',
    title: 'Staff and badges',
    what: 'Roles, licences, badge cards, PIN resets',
    who: 'engineering',
  },
  {
    to: '/desk/devices',
    title: 'Tablets and TVs',
    what: 'Enrol, rename or revoke kiosk tablets; make board links for TVs',
    who: 'engineering',
  },
  {
    to: '/desk/audit',
    title: 'Audit trail',
    what: 'Verify that no record was changed behind the app',
    who: 'engineering',
  },
];

const sees = (roles: Role[], who: Who) =>
  who === 'everyone' ||
  roles.includes('engineering') ||
  (who === 'leads and engineering' && roles.includes('shift_lead'));

export function DeskHomeRoute() {
  const user = useDeskUser();
  return (
    <DeskPage title={`Good to see you, ${user.name.split(' ')[0]}`}>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {homeCards
          .filter((card) => sees(user.roles, card.who))
          .map((card) => (
            <Link
              key={card.to}
              to={card.to}
              className="flex min-h-[104px] flex-col justify-end gap-1 rounded-xl border-2 border-ink-line bg-ink-soft p-4 hover:border-signal-bright"
            >
              <span className="text-[22px] font-bold">{card.title}</span>
              <span className="text-[16px] text-ink-muted">{card.what}</span>
            </Link>
          ))}
      </div>
    </DeskPage>
  );
}
