import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { BoardLinkCreated } from '@shared/schemas/board-links';
import { createBoardLinkSchema } from '@shared/schemas/board-links';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { ConfirmRevoke } from '@/components/ui/confirm-revoke';
import { Notice, RefusalNotices } from '@/components/ui/notice';
import { useBoardLinks } from '../api/get-board-links';
import { useCreateBoardLink } from '../api/create-board-link';
import { useRevokeBoardLink } from '../api/revoke-board-link';
import { QrCode } from '@/components/ui/qr-code';
import { recordTime } from '@/lib/when';
import { inputClass } from '@/components/desk/desk-form';
import { baseWords, type BaseOption } from '@/lib/base-words';
import { fieldError } from '@/lib/field-error';

/**
 * The bases a new screen shows, as large toggles: a crew-room TV at one base shows that base's airframes; none
 * chosen, it shows the whole fleet.
 */
function BaseToggles({
  bases,
  chosen,
  onChange,
}: {
  bases: readonly BaseOption[];
  chosen: readonly string[];
  onChange: (codes: string[]) => void;
}) {
  const { t } = useTranslation('boardLinks');
  const names = bases.filter((b) => chosen.includes(b.code)).map(baseWords);
  return (
    <fieldset className="flex w-full flex-col gap-2" data-testid="board-link-bases">
      <legend className="mb-2 text-[17px] font-semibold">{t('make.basesLabel')}</legend>
      <div className="flex flex-wrap gap-2">
        {bases.map((base) => {
          const on = chosen.includes(base.code);
          return (
            <button
              key={base.code}
              type="button"
              aria-pressed={on}
              onClick={() =>
                onChange(on ? chosen.filter((code) => code !== base.code) : [...chosen, base.code])
              }
              className={`min-h-12 rounded-lg border-2 px-4 text-[17px] font-semibold ${on ? 'border-paper bg-paper text-ink' : 'border-ink-line bg-ink text-paper'}`}
            >
              {on && (
                <svg
                  width="18"
                  height="18"
                  viewBox="0 0 32 32"
                  aria-hidden="true"
                  className="mr-2 inline-block"
                >
                  <path
                    d="M6 16.5l6.5 6.5L26 9.5"
                    fill="none"
                    stroke="currentColor"
                    strokeWidth="4.5"
                    strokeLinecap="round"
                    strokeLinejoin="round"
                  />
                </svg>
              )}
              {baseWords(base)}
            </button>
          );
        })}
      </div>
      <p className="text-[16px] text-ink-muted">
        {names.length === 0 ? t('make.everyBase') : t('make.theseBases', { bases: names })}
      </p>
    </fieldset>
  );
}

/** Engineering makes a read-only link per TV, shows it once (only its hash is kept), and revokes it when the TV goes. */
export function BoardLinksPage({ bases }: { bases: readonly BaseOption[] }) {
  const { t } = useTranslation('boardLinks');
  const links = useBoardLinks();
  const create = useCreateBoardLink();
  const revoke = useRevokeBoardLink();
  const [name, setName] = useState('');
  const [chosen, setChosen] = useState<string[]>([]);
  const [problem, setProblem] = useState<string | null>(null);
  const [created, setCreated] = useState<BoardLinkCreated | null>(null);
  const url = created ? new URL(created.path, window.location.origin).toString() : null;

  return (
    <div className="flex flex-col gap-6">
      <section className="flex flex-col gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
        <h2 className="text-[17px] font-bold">{t('make.title')}</h2>
        <p className="text-[17px] text-ink-muted">{t('make.intro')}</p>
        <form
          className="flex flex-wrap gap-4"
          onSubmit={(event) => {
            event.preventDefault();
            const parsed = createBoardLinkSchema.safeParse({ name, bases: chosen });
            if (!parsed.success) {
              setProblem(fieldError(parsed.error.issues[0]?.message) ?? t('make.nameTheScreen'));
              return;
            }
            setProblem(null);
            create.mutate(parsed.data, {
              onSuccess: (result) => {
                setCreated(result);
                setName('');
                setChosen([]);
              },
            });
          }}
        >
          <label className="flex min-w-[320px] flex-1 flex-col gap-2">
            <span className="text-[17px] font-semibold">{t('make.nameLabel')}</span>
            <input
              name="board-link-name"
              value={name}
              onChange={(event) => setName(event.target.value)}
              placeholder={t('make.namePlaceholder')}
              className={inputClass}
            />
          </label>
          <Button type="submit" tone="primary" className="self-end" disabled={create.isPending}>
            {t('make.create')}
          </Button>
          {bases.length > 1 && <BaseToggles bases={bases} chosen={chosen} onChange={setChosen} />}
        </form>
        <RefusalNotices title={t('make.refused')} problem={problem} failed={create} failedTone="caution" />
        {created && url && (
          <div className="flex flex-wrap items-center gap-6" data-testid="board-link-created">
            <QrCode url={url} alt={t('created.qrAlt', { url })} testId="board-link-qr" />
            <div className="flex min-w-0 flex-1 flex-col gap-2">
              <div className="text-[18px] font-semibold">{t('created.openOn', { name: created.name })}</div>
              <code data-testid="board-link-url" className="break-all rounded-lg bg-ink p-3 text-[17px]">
                {url}
              </code>
              <div className="text-[17px] text-ink-muted">{t('created.shownOnce')}</div>
            </div>
          </div>
        )}
      </section>

      <section className="flex flex-col gap-3">
        <h2 className="text-[17px] font-bold">{t('list.title')}</h2>
        {links.isPending && <p className="text-ink-muted">{t('list.loading')}</p>}
        {links.isError && (
          <Notice tone="warning" title={t('list.notLoaded')}>
            {errorMessage(links.error)}
          </Notice>
        )}
        {revoke.isError && (
          <Notice tone="caution" title={t('list.notRevoked')}>
            {errorMessage(revoke.error)}
          </Notice>
        )}
        {links.data?.length === 0 && <p className="text-[17px] text-ink-muted">{t('list.empty')}</p>}
        <ul className="flex flex-col gap-3">
          {links.data?.map((link) => (
            <li
              key={link.id}
              data-testid={`board-link-${link.id}`}
              className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
            >
              <div className="min-w-[260px] flex-1">
                <div className="text-[19px] font-semibold">{link.name}</div>
                <div className="text-[16px] text-ink-muted">
                  {t('list.made', {
                    time: recordTime(link.createdAt, t('list.never')),
                    by: link.createdBy,
                    lastSeen: recordTime(link.lastSeenAt, t('list.never')),
                  })}
                  {link.revokedAt
                    ? t('list.revokedAt', { time: recordTime(link.revokedAt, t('list.never')) })
                    : ''}
                </div>
                <div className="text-[16px] text-ink-muted" data-testid="board-link-shows">
                  {link.bases.length === 0
                    ? t('list.everyBase')
                    : t('list.shows', { bases: link.bases.map(baseWords) })}
                </div>
              </div>
              <span
                className={`rounded-lg px-3 py-1.5 text-[17px] font-bold ${link.revokedAt ? 'border-2 border-ink-line bg-ink-raised text-paper line-through' : 'bg-normal-bright text-on-fill'}`}
              >
                {link.revokedAt ? t('list.revoked') : t('list.working')}
              </span>
              {!link.revokedAt && (
                <ConfirmRevoke
                  name={link.name}
                  pending={revoke.isPending}
                  onRevoke={(settled) => revoke.mutate(link.id, { onSettled: settled })}
                />
              )}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
