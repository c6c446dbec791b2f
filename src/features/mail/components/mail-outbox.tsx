import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useOutbox } from '../api/get-outbox';
import { recordTime } from '@/lib/when';

/** What the local fake SMTP server caught: in the demo, what maintenance control would have received. */
export function MailOutbox() {
  const { t } = useTranslation('mail');
  const outbox = useOutbox();
  const [open, setOpen] = useState<Set<number>>(new Set());
  const toggle = (id: number) =>
    setOpen((current) => {
      const next = new Set(current);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <div className="flex flex-col gap-4">
      <p className="text-[17px] text-ink-muted">{t('outbox.intro')}</p>
      {outbox.isPending && <p className="text-ink-muted">{t('outbox.loading')}</p>}
      {outbox.isError && (
        <Notice tone="warning" title={t('outbox.notLoaded')}>
          {errorMessage(outbox.error)}
        </Notice>
      )}
      {outbox.data?.length === 0 && <p className="text-[18px]">{t('outbox.empty')}</p>}
      <ul className="flex flex-col gap-3" aria-label={t('outbox.listLabel')}>
        {outbox.data?.map((mail) => (
          <li
            key={mail.id}
            data-testid={`mail-${mail.id}`}
            className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
          >
            <div className="flex flex-wrap items-center gap-4">
              <div className="min-w-[320px] flex-1">
                <div className="text-[19px] font-semibold">{mail.subject}</div>
                <div className="text-[16px] text-ink-muted">
                  {t('outbox.toAndTime', { to: mail.to, time: recordTime(mail.receivedAt) })}
                </div>
              </div>
              <Button tone="neutral" aria-expanded={open.has(mail.id)} onClick={() => toggle(mail.id)}>
                {open.has(mail.id) ? t('outbox.hideText') : t('outbox.showText')}
              </Button>
            </div>
            {open.has(mail.id) && (
              <pre className="whitespace-pre-wrap break-words rounded-lg bg-ink p-4 font-sans text-[17px] leading-snug">
                {mail.text}
              </pre>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
