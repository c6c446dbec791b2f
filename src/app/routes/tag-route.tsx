import { Link, Navigate, useParams } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { useTag } from '@/features/airframes/api/get-tag';
import { PageShell } from '@/components/ui/page-shell';
import { Notice } from '@/components/ui/notice';
import { kioskLinkClass } from '@/components/ui/kiosk-link';
import { ApiRequestError, errorMessage } from '@/lib/api-client';

/** A scanned airframe tag: resolve it, sign in first when needed, then open the airframe. */
export function TagRoute() {
  const { token = '' } = useParams();
  const session = useSession();
  const canLook = Boolean(session.data?.kiosk || session.data?.user);
  const tag = useTag(token, canLook);

  if (session.isPending || (canLook && tag.isPending))
    return <p className="p-6 text-lead">Reading the tag…</p>;
  if (!canLook) {
    return (
      <PageShell title="Airframe tag">
        <div className="flex max-w-[900px] flex-col gap-5">
          <Notice tone="caution" big title="Sign in first">
            Tags open on an enrolled kiosk tablet or after a desk sign-in.
          </Notice>
          <div className="flex gap-4">
            <Link className={kioskLinkClass} to="/kiosk">
              Kiosk sign-in
            </Link>
            <Link className={kioskLinkClass} to="/desk">
              Desk sign-in
            </Link>
          </div>
        </div>
      </PageShell>
    );
  }
  if (tag.isError) {
    const code = tag.error instanceof ApiRequestError ? tag.error.code : null;
    const title =
      code === 'tag_revoked'
        ? 'This tag no longer works'
        : code === 'tag_unknown'
          ? 'Not one of our tags'
          : 'The tag could not be read';
    return (
      <PageShell title="Airframe tag">
        <div className="flex max-w-[1000px] flex-col gap-5">
          <Notice tone="warning" big title={title}>
            {errorMessage(tag.error)}
          </Notice>
          <Link className={kioskLinkClass} to={session.data?.kiosk ? '/kiosk/airframes' : '/board'}>
            Pick the airframe from the list instead
          </Link>
        </div>
      </PageShell>
    );
  }
  if (!tag.data) return <p className="p-6 text-lead">Reading the tag…</p>;
  const target = `/kiosk/airframes/${tag.data.airframeId}`;
  const data = session.data;
  if (data?.kiosk && data.user && data.channel === 'kiosk') return <Navigate to={target} replace />;
  if (data?.kiosk) return <Navigate to={`/kiosk?next=${encodeURIComponent(target)}`} replace />;
  return (
    <PageShell title={`Airframe ${tag.data.fleetNumber}`}>
      <Notice tone="info" big title={`This is ${tag.data.fleetNumber}`}>
        Checks are recorded on a kiosk tablet. Its state is on the hangar board.
      </Notice>
      <Link className={`${kioskLinkClass} mt-5 self-start`} to="/board">
        Hangar board
      </Link>
    </PageShell>
  );
}
