import { Link, Navigate, useNavigate } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { DeskSignInForm } from '@/features/auth/components/desk-sign-in-form';
import { KioskTablets } from '@/features/kiosks/components/kiosk-tablets';
import { BoardLinksPage } from '@/features/board-links/components/board-links-page';
import { Notice } from '@/components/ui/notice';
import { PageShell } from '@/components/ui/page-shell';
import { useDeskUser } from './desk-layout';

export function DeskSignInRoute() {
  const session = useSession();
  const navigate = useNavigate();
  if (session.data?.user && session.data.channel === 'desk') return <Navigate to="/desk/home" replace />;
  return (
    <PageShell title="Desk sign-in" eyebrow="Shift leads and engineering">
      <div className="flex flex-col gap-5">
        <p className="text-lead text-ink-muted">Mechanics sign in at a kiosk tablet with badge and PIN.</p>
        <DeskSignInForm onSignedIn={() => navigate('/desk/home', { replace: true })} />
        <Link to="/" className="text-[22px] underline">
          Back to start
        </Link>
      </div>
    </PageShell>
  );
}

const card =
  'flex min-h-[132px] flex-col justify-end gap-2 rounded-2xl border-2 border-ink-line bg-ink-soft p-6 active:scale-[0.99]';

export function DeskHomeRoute() {
  const user = useDeskUser();
  return (
    <>
      <h1 className="text-[40px] font-bold">Good to see you, {user.name.split(' ')[0]}</h1>
      <div className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3">
        <Link to="/board" className={card}>
          <span className="text-[36px] font-bold">Hangar board</span>
          <span className="text-[22px] text-ink-muted">Every airframe, unserviceable first, live</span>
        </Link>
        {(user.roles.includes('shift_lead') || user.roles.includes('engineering')) && (
          <>
            <Link to="/desk/holds" className={card}>
              <span className="text-[36px] font-bold">Holds</span>
              <span className="text-[22px] text-ink-muted">
                Review, record the corrective action, countersign and release
              </span>
            </Link>
            <Link to="/desk/defects" className={card}>
              <span className="text-[36px] font-bold">Defects and releases</span>
              <span className="text-[22px] text-ink-muted">
                The tech log per airframe: rectify, defer, certify, release to service; checks left open
              </span>
            </Link>
            <Link to="/desk/handover" className={card}>
              <span className="text-[36px] font-bold">Shift handover</span>
              <span className="text-[22px] text-ink-muted">
                The shift's checks, holds and fluid, sent by e-mail
              </span>
            </Link>
          </>
        )}
        {user.roles.includes('engineering') && (
          <>
            <Link to="/desk/mail" className={card}>
              <span className="text-[36px] font-bold">Mail outbox</span>
              <span className="text-[22px] text-ink-muted">What the hold and handover e-mails said</span>
            </Link>
          </>
        )}
        {(user.roles.includes('shift_lead') || user.roles.includes('engineering')) && (
          <>
            <Link to="/desk/records" className={card}>
              <span className="text-[36px] font-bold">Records</span>
              <span className="text-[22px] text-ink-muted">
                Search signed checks, open the full record, export CSV
              </span>
            </Link>
            <Link to="/desk/trends" className={card}>
              <span className="text-[36px] font-bold">Fluid trends</span>
              <span className="text-[22px] text-ink-muted">
                Levels and fluid added per flight hour, with the alert line
              </span>
            </Link>
          </>
        )}
        {user.roles.includes('engineering') && (
          <>
            <Link to="/desk/types" className={card}>
              <span className="text-[36px] font-bold">Types and limits</span>
              <span className="text-[22px] text-ink-muted">
                Check cards and limit bands, drafted and published as versions
              </span>
            </Link>
            <Link to="/desk/fleet" className={card}>
              <span className="text-[36px] font-bold">Airframes and tags</span>
              <span className="text-[22px] text-ink-muted">Add airframes, print and reissue QR tags</span>
            </Link>
            <Link to="/desk/staff" className={card}>
              <span className="text-[36px] font-bold">Staff and badges</span>
              <span className="text-[22px] text-ink-muted">Roles, licences, badge cards, PIN resets</span>
            </Link>
            <Link to="/desk/devices" className={card}>
              <span className="text-[36px] font-bold">Tablets and TVs</span>
              <span className="text-[22px] text-ink-muted">
                Enrol, rename or revoke kiosk tablets; make board links for TVs
              </span>
            </Link>
            <Link to="/desk/audit" className={card}>
              <span className="text-[36px] font-bold">Audit trail</span>
              <span className="text-[22px] text-ink-muted">
                Verify that no record was changed behind the app
              </span>
            </Link>
          </>
        )}
      </div>
    </>
  );
}

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
    <>
      <h1 className="text-[40px] font-bold">Tablets and TVs</h1>
      <KioskTablets />
      <BoardLinksPage />
    </>
  );
}
