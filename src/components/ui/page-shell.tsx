import type { ReactNode } from 'react';
import { LimitsNotice } from './limits-notice';

interface PageShellProps {
  title: ReactNode;
  /** Small line above the title: where in the flow this is. */
  eyebrow?: ReactNode;
  actions?: ReactNode;
  /** Screens that show limits carry the notice in their footer. */
  showsLimits?: boolean;
  children: ReactNode;
}

/** The kiosk frame: a dark instrument-panel header rail, content, and the limits notice where it applies. */
export function PageShell({ title, eyebrow, actions, showsLimits = false, children }: PageShellProps) {
  return (
    <div className="flex min-h-dvh flex-col bg-ink text-body text-paper">
      <header className="flex flex-wrap items-center gap-4 border-b-2 border-ink-line bg-ink-soft px-6 py-3">
        <div className="mr-auto min-w-0">
          {eyebrow && (
            <div className="text-[20px] font-semibold uppercase tracking-[0.12em] text-ink-muted">
              {eyebrow}
            </div>
          )}
          <h1 className="text-[34px] font-bold leading-tight">{title}</h1>
        </div>
        {actions && <div className="flex flex-wrap items-center gap-3">{actions}</div>}
      </header>
      <main className="flex flex-1 flex-col px-6 py-5">{children}</main>
      {showsLimits && (
        <footer className="border-t-2 border-ink-line bg-ink-soft px-6 py-3">
          <LimitsNotice />
        </footer>
      )}
    </div>
  );
}
