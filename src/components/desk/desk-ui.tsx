import type { ReactNode, TableHTMLAttributes } from 'react';
import { errorMessage } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';
import { LimitsNotice } from '@/components/ui/limits-notice';
import { useTranslation } from 'react-i18next';

export function Panel({
  title,
  actions,
  children,
}: {
  title?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
      {(title || actions) && (
        <div className="flex flex-wrap items-center gap-3">
          {title && <h2 className="mr-auto text-[22px] font-bold">{title}</h2>}
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}

export function DeskPage({
  title,
  actions,
  showsLimits = false,
  children,
}: {
  title: ReactNode;
  actions?: ReactNode;
  showsLimits?: boolean;
  children: ReactNode;
}) {
  return (
    <div className="flex flex-col gap-4 text-[17px]">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto text-[32px] font-bold leading-tight">{title}</h1>
        {actions}
      </div>
      {showsLimits && (
        <div className="rounded-lg border-2 border-signal-edge/60 bg-ink-soft px-4 py-2">
          <LimitsNotice />
        </div>
      )}
      {children}
    </div>
  );
}

export function ServerError({ error, title }: { error: unknown; title?: string }) {
  const { t } = useTranslation('common');
  if (!error) return null;
  return (
    <Notice tone="caution" title={title ?? t('desk.notDone')}>
      {errorMessage(error)}
    </Notice>
  );
}

const tableClass =
  'w-full border-collapse text-left text-[16px] [&_td]:border-t [&_td]:border-ink-line [&_td]:px-2 [&_td]:py-1.5 [&_th]:px-2 [&_th]:py-1.5 [&_th]:font-semibold [&_th]:text-ink-muted';

/**
 * A desk table. Wider than an upright tablet, it scrolls sideways inside its panel; the page itself does not.
 */
export function DeskTable(props: TableHTMLAttributes<HTMLTableElement>) {
  return (
    <div className="overflow-x-auto">
      <table {...props} className={tableClass} />
    </div>
  );
}

export function Loading({ what }: { what: string }) {
  const { t } = useTranslation('common');
  return <p className="text-ink-muted">{t('desk.loading', { what })}</p>;
}

/** A change marker that never relies on colour: a word and a sign. */
export function ChangeTag({ change }: { change: 'added' | 'removed' | 'changed' }) {
  const style = {
    added: 'border-normal-edge text-normal-text',
    removed: 'border-warning-edge text-warning-text',
    changed: 'border-caution-edge text-caution-text',
  }[change];
  const sign = { added: '+', removed: '−', changed: '~' }[change];
  const { t } = useTranslation('common');
  return (
    <span
      className={`inline-flex items-center gap-1 rounded border-2 px-1.5 text-[14px] font-bold uppercase ${style}`}
    >
      <span aria-hidden>{sign}</span>
      {t(`desk.change.${change}`)}
    </span>
  );
}
