import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

/** The big glove-sized link the kiosk's dead ends offer (back to start, desk sign-in, the board). */
export const kioskLinkClass =
  'inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-6 text-[24px] font-semibold';

export function KioskLink({
  to,
  className = '',
  children,
}: {
  to: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <Link to={to} className={`${kioskLinkClass} ${className}`.trim()}>
      {children}
    </Link>
  );
}
