import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { AuthorisationView, StaffMember } from '@shared/schemas/staff';
import { grantAuthorisationSchema } from '@shared/schemas/staff';
import {
  ataChapters,
  ataChapterWords,
  ataScopes,
  authorisationWords,
  licenceCategories,
  type LicenceCategory,
} from '@shared/domain/authorisation';
import { calendarDay } from '@/lib/when';
import { recordTime } from '@/lib/when';
import { useAuthorisations, useGrantAuthorisation, useRevokeAuthorisation } from '../api/authorisations';
import { useTypes } from '@/lib/shared-queries';
import { Loading, Panel, ServerError, DeskTable } from '@/components/desk/desk-ui';
import { Field, Input, Select, Options } from '@/components/desk/desk-form';
import { Button } from '@/components/ui/button';
import { fieldError } from '@/lib/field-error';

const chapterKeys = ataScopes.filter((k) => k !== 'all');

/**
 * A person's certifying authorisations (EASA Part-145 145.A.30 and 145.A.35, from memory): category, types, the
 * ATA chapters covered and the expiry date, in words; engineering grants and withdraws them, each change audited.
 */
export function AuthorisationsPanel({ person, onClose }: { person: StaffMember; onClose: () => void }) {
  const { t } = useTranslation('staff');
  const chapterWord = (chapter: string) => ataChapterWords(chapter);
  // The reference has its own column.
  const words = (a: AuthorisationView) =>
    authorisationWords({
      category: a.category,
      typeCodes: a.typeCodes,
      scope: a.scope,
      expiresOn: a.expiresOn,
    });
  const list = useAuthorisations(person.id);
  const grant = useGrantAuthorisation(person.id);
  const revoke = useRevokeAuthorisation(person.id);
  const types = useTypes();
  const [category, setCategory] = useState<LicenceCategory>('B1');
  const [typeCodes, setTypeCodes] = useState<string[]>([]);
  const [all, setAll] = useState(true);
  const [chapters, setChapters] = useState<string[]>([]);
  const [expiresOn, setExpiresOn] = useState('');
  const [reference, setReference] = useState('');
  const [problem, setProblem] = useState<{ path: string; message: string } | null>(null);
  const [confirm, setConfirm] = useState<number | null>(null);
  const toggle = (list: string[], value: string, on: boolean) =>
    on ? [...list, value] : list.filter((v) => v !== value);

  return (
    <Panel
      title={t('authorisations.title', { name: person.name })}
      actions={
        <Button tone="quiet" onClick={onClose}>
          {t('authorisations.close')}
        </Button>
      }
    >
      <div data-testid="authorisations">
        {list.isPending ? (
          <Loading what={t('authorisations.loadingWhat')} />
        ) : list.isError ? (
          <ServerError error={list.error} />
        ) : list.data.length === 0 ? (
          <p className="text-ink-muted">
            {t('authorisations.none', { firstName: person.name.split(' ')[0] })}
          </p>
        ) : (
          <DeskTable>
            <thead>
              <tr>
                <th>{t('authorisations.table.authorisation')}</th>
                <th>{t('authorisations.table.reference')}</th>
                <th>{t('authorisations.table.granted')}</th>
                <th>{t('authorisations.table.state')}</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {list.data.map((a) => {
                const expired = a.expiresOn < new Date().toISOString().slice(0, 10);
                return (
                  <tr key={a.id} className={a.revokedAt || expired ? 'text-ink-muted' : ''}>
                    <td className="font-semibold">{words(a)}</td>
                    <td>{a.reference}</td>
                    <td>
                      {t('authorisations.grantedBy', { by: a.grantedBy, time: recordTime(a.grantedAt) })}
                    </td>
                    <td>
                      {a.revokedAt
                        ? t('authorisations.state.withdrawn', { time: recordTime(a.revokedAt) })
                        : expired
                          ? t('authorisations.state.expired', { day: calendarDay(a.expiresOn) })
                          : t('authorisations.state.validUntil', { day: calendarDay(a.expiresOn) })}
                    </td>
                    <td className="flex justify-end gap-2">
                      {!a.revokedAt &&
                        (confirm === a.id ? (
                          <>
                            <Button
                              className="h-8"
                              tone="stop"
                              onClick={() => revoke.mutate(a.id, { onSettled: () => setConfirm(null) })}
                            >
                              {t('authorisations.confirmWithdraw')}
                            </Button>
                            <Button className="h-8" tone="quiet" onClick={() => setConfirm(null)}>
                              {t('authorisations.no')}
                            </Button>
                          </>
                        ) : (
                          <Button className="h-8" onClick={() => setConfirm(a.id)}>
                            {t('authorisations.withdraw')}
                          </Button>
                        ))}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </DeskTable>
        )}
      </div>
      <ServerError error={revoke.error} title={t('authorisations.notWithdrawn')} />

      <form
        noValidate
        className="flex flex-col gap-3 border-t-2 border-ink-line pt-3"
        aria-label={t('grant.title')}
        onSubmit={(event) => {
          event.preventDefault();
          const parsed = grantAuthorisationSchema.safeParse({
            category,
            typeCodes,
            scope: all ? ['all'] : chapters,
            expiresOn,
            reference,
          });
          if (!parsed.success) {
            const issue = parsed.error.issues[0];
            setProblem({
              path: String(issue?.path[0] ?? ''),
              message: fieldError(issue?.message) ?? t('grant.checkTheForm'),
            });
            return;
          }
          setProblem(null);
          grant.mutate(parsed.data, {
            onSuccess: () => {
              setTypeCodes([]);
              setChapters([]);
              setAll(true);
              setExpiresOn('');
              setReference('');
            },
          });
        }}
      >
        <h3 className="text-[19px] font-bold">{t('grant.title')}</h3>
        <div className="grid grid-cols-[120px_1fr_170px_200px] gap-3">
          <Field
            label={t('grant.category')}
            error={problem?.path === 'category' ? problem.message : undefined}
          >
            <Select value={category} onChange={(e) => setCategory(e.target.value as LicenceCategory)}>
              <Options items={licenceCategories} value={(c) => c} label={(c) => c} />
            </Select>
          </Field>
          <Field label={t('grant.types')} error={problem?.path === 'typeCodes' ? problem.message : undefined}>
            <div className="flex h-10 flex-wrap items-center gap-4">
              {types.data?.map((type) => (
                <label key={type.id} className="flex items-center gap-1">
                  <input
                    type="checkbox"
                    className="size-5"
                    checked={typeCodes.includes(type.code)}
                    onChange={(e) => setTypeCodes(toggle(typeCodes, type.code, e.target.checked))}
                  />
                  {type.code}
                </label>
              ))}
            </div>
          </Field>
          <Field
            label={t('grant.validUntil')}
            error={problem?.path === 'expiresOn' ? problem.message : undefined}
          >
            <Input type="date" value={expiresOn} onChange={(e) => setExpiresOn(e.target.value)} />
          </Field>
          <Field
            label={t('grant.reference')}
            error={problem?.path === 'reference' ? problem.message : undefined}
          >
            <Input
              value={reference}
              onChange={(e) => setReference(e.target.value)}
              placeholder={t('grant.referencePlaceholder')}
            />
          </Field>
        </div>
        <Field label={t('grant.scope')} error={problem?.path === 'scope' ? problem.message : undefined}>
          <div className="flex flex-wrap items-center gap-x-5 gap-y-2">
            <label className="flex items-center gap-1 font-semibold">
              <input
                type="checkbox"
                className="size-5"
                checked={all}
                onChange={(e) => setAll(e.target.checked)}
              />
              {ataChapters.all}
            </label>
            {!all &&
              chapterKeys.map((key) => (
                <label key={key} className="flex items-center gap-1">
                  <input
                    type="checkbox"
                    className="size-5"
                    checked={chapters.includes(key)}
                    onChange={(e) => setChapters(toggle(chapters, key, e.target.checked))}
                  />
                  {chapterWord(key)}
                </label>
              ))}
          </div>
        </Field>
        <div>
          <Button type="submit" tone="primary" disabled={grant.isPending}>
            {t('grant.submit')}
          </Button>
        </div>
        <ServerError error={grant.error} title={t('grant.notGranted')} />
      </form>
    </Panel>
  );
}
