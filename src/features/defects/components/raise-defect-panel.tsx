import { useState } from 'react';
import { raiseDefectSchema } from '@shared/schemas/defects';
import { BigCheckbox } from '@/components/ui/big-checkbox';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { secretFor, type SigningChannel } from '@/components/ui/signature-entry';
import { useRaiseDefect } from '../api/raise-defect';
import { ChapterChooser } from './chapter-chooser';
import { SignedActForm, TextBox } from './signed-act-form';
import { useTranslation } from 'react-i18next';
import { fieldError } from '@/lib/field-error';

/**
 * "Raise a defect" for whoever found it (a pilot, a mechanic, a lead), signed with the PIN on a kiosk or the
 * password at the desk. It goes into the tech log with the next number and the airframe is unserviceable until
 * the defect is rectified or deferred.
 */
export function RaiseDefectPanel({
  airframeId,
  fleetNumber,
  channel,
  maintenance = false,
}: {
  airframeId: number;
  fleetNumber: string;
  channel: SigningChannel;
  /** Mechanics and leads also say whether the rectification needs an independent inspection. */
  maintenance?: boolean;
}) {
  const { t } = useTranslation('defects');
  const raise = useRaiseDefect(airframeId);
  const [open, setOpen] = useState(false);
  const [description, setDescription] = useState('');
  const [chapter, setChapter] = useState<string | null>(null);
  const [inspection, setInspection] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  if (!open) {
    return (
      <div className="flex flex-col gap-3">
        {raise.isSuccess && (
          <div data-testid="defect-raised">
            <Notice
              tone="caution"
              title={t('raise.raised', { number: raise.data.number, fleet: fleetNumber })}
            >
              {raise.data.description}. {t('raise.raisedText', { fleet: fleetNumber })}
            </Notice>
          </div>
        )}
        <Button
          tone="neutral"
          size="large"
          onClick={() => {
            raise.reset();
            setOpen(true);
          }}
        >
          {t('raise.button')}
        </Button>
      </div>
    );
  }
  return (
    <SignedActForm
      channel={channel}
      title={t('raise.title', { fleet: fleetNumber })}
      intro={t('raise.intro')}
      submitLabel={t('raise.submit')}
      isPending={raise.isPending}
      error={raise.error}
      problem={problem}
      testId="raise-defect"
      onCancel={() => setOpen(false)}
      onSubmit={(secret) => {
        const parsed = raiseDefectSchema.safeParse({
          description,
          chapter,
          ...(maintenance ? { needsIndependentInspection: inspection } : {}),
          ...secretFor(channel, secret),
        });
        if (!parsed.success) {
          setProblem(fieldError(parsed.error.issues[0]?.message) ?? t('raise.check'));
          return false;
        }
        setProblem(null);
        raise.mutate(parsed.data, {
          onSuccess: () => {
            setOpen(false);
            setDescription('');
            setChapter(null);
            setInspection(false);
          },
        });
        return true;
      }}
    >
      <TextBox
        label={t('raise.what')}
        value={description}
        onChange={setDescription}
        multiline
        placeholder={t('raise.placeholder')}
      />
      <ChapterChooser value={chapter} onChange={setChapter} />
      {maintenance && (
        <BigCheckbox checked={inspection} onChange={setInspection} testId="defect-needs-inspection">
          {t('raise.inspection')}
        </BigCheckbox>
      )}
    </SignedActForm>
  );
}
