import { useState } from 'react';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { releaseAirframeSchema, releaseStatement } from '@shared/schemas/releases';
import { recordTime } from '@/lib/when';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { secretFor, type SigningChannel } from '@/components/ui/signature-entry';
import { stateWords } from '@/components/ui/state-badge';
import { useReleases } from '../api/get-releases';
import { useReleaseAirframe } from '../api/release-airframe';
import { chapterName } from './defect-card';
import { SignedActForm } from './signed-act-form';
import { useTranslation } from 'react-i18next';
import { authorisationWords } from '@shared/domain/authorisation';
import { phraseWords } from '@shared/i18n/phrase';
import { fieldError } from '@/lib/field-error';

/**
 * The certificate of release to service for the whole airframe (EASA Part-145 145.A.50, from memory): its wording
 * shown before signing, signed under the signer's authorisation; past certificates listed with who and under what.
 */
export function ReleasePanel({
  airframe,
  channel,
  canSign,
}: {
  airframe: AirframeSummary;
  channel: SigningChannel;
  canSign: boolean;
}) {
  const { t } = useTranslation('defects');
  const releases = useReleases(airframe.id);
  const release = useReleaseAirframe(airframe.id);
  const [open, setOpen] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const unserviceable = airframe.state === 'unserviceable';
  return (
    <section
      className="flex flex-col gap-4 rounded-2xl border-2 border-ink-line bg-ink-soft p-5"
      aria-label={t('release.title')}
      data-testid="release-panel"
    >
      <h2 className="text-[30px] font-bold">{t('release.title')}</h2>
      {airframe.release ? (
        <p className="text-[24px] font-semibold text-normal-text" data-testid="release-in-force">
          {t('release.inForce', { name: airframe.release.by, at: recordTime(airframe.release.at) })}
        </p>
      ) : (
        <p className="text-[24px] text-ink-muted" data-testid="release-in-force">
          {t('release.noneInForce')}
        </p>
      )}
      {release.isSuccess && (
        <Notice tone="normal" title={t('release.released', { fleet: airframe.fleetNumber })}>
          {t('release.signedUnder', {
            name: release.data.certifiedBy.name,
            authorisation: release.data.authorisation ? authorisationWords(release.data.authorisation) : '',
          })}
        </Notice>
      )}
      {canSign && unserviceable && (
        <Notice
          tone="warning"
          title={t('release.is', {
            fleet: airframe.fleetNumber,
            state: stateWords(airframe.state, airframe.causes).toLowerCase(),
          })}
        >
          {t('release.blocked')}
        </Notice>
      )}
      {canSign && !unserviceable && !open && (
        <Button
          tone="go"
          size="large"
          className="self-start"
          onClick={() => {
            release.reset();
            setOpen(true);
          }}
        >
          {t('release.sign')}
        </Button>
      )}
      {canSign && !unserviceable && open && (
        <SignedActForm
          channel={channel}
          title={t('release.formTitle', { fleet: airframe.fleetNumber, type: airframe.type.code })}
          intro={
            <div className="flex flex-col gap-2">
              <span>{t('release.youSign')}</span>
              <blockquote
                className="rounded-xl border-l-8 border-normal-edge bg-ink-soft p-4 text-[24px] italic"
                data-testid="release-statement"
              >
                {releaseStatement}
              </blockquote>
              {airframe.defects.length > 0 && (
                <span>
                  {t('release.carries', {
                    defects: airframe.defects
                      .map((d) =>
                        t('release.carriedDefect', { number: d.number, reason: phraseWords(d.reason) }),
                      )
                      .join('; '),
                  })}
                </span>
              )}
            </div>
          }
          submitLabel={t('release.submit')}
          tone="go"
          isPending={release.isPending}
          error={release.error}
          problem={problem}
          testId="release-airframe"
          onCancel={() => setOpen(false)}
          onSubmit={(secret) => {
            const parsed = releaseAirframeSchema.safeParse(secretFor(channel, secret));
            if (!parsed.success) {
              setProblem(fieldError(parsed.error.issues[0]?.message) ?? t('release.typeSecret'));
              return false;
            }
            setProblem(null);
            release.mutate(parsed.data, { onSuccess: () => setOpen(false) });
            return true;
          }}
        />
      )}
      {releases.isError && (
        <Notice tone="caution" title={t('release.earlierNotLoaded')}>
          {errorMessage(releases.error)}
        </Notice>
      )}
      {releases.data && releases.data.length > 0 && (
        <details className="text-[22px]">
          <summary className="min-h-touch cursor-pointer py-4 font-semibold">
            {t('release.earlier', { count: releases.data.length })}
          </summary>
          <ul className="flex flex-col gap-2">
            {releases.data.map((r) => (
              <li key={r.id} className="rounded-xl border-2 border-ink-line bg-ink p-3">
                <div className="font-semibold">
                  {recordTime(r.signedAt)} · {r.certifiedBy.name}
                  {r.certifiedBy.licenceNumber
                    ? t('release.licence', { licence: r.certifiedBy.licenceNumber })
                    : ''}
                </div>
                <div className="text-[20px] text-ink-muted">
                  {r.authorisation
                    ? t('release.under', { authorisation: authorisationWords(r.authorisation) })
                    : t('release.beforeAuthorisations')}{' '}
                  · {t('release.work')}{' '}
                  {r.chapters.length === 0 ? t('release.noWork') : r.chapters.map(chapterName).join(', ')}
                </div>
              </li>
            ))}
          </ul>
        </details>
      )}
    </section>
  );
}
