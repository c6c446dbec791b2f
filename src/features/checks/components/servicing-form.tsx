import { useEffect, useLayoutEffect, useRef, useState } from 'react';
import type { Checkpoint, Fluid, ReadingEntry } from '@shared/schemas/limits';
import { servicingEntrySchema } from '@shared/schemas/checks';
import { checkFluidAllowed, knownFluids } from '@shared/domain/servicing';
import { topUpToolRule } from '@shared/domain/tools';
import { calendarDay } from '@/lib/when';
import { localDay } from '@shared/domain/local-time';
import { convert } from '@shared/domain/units';
import { BottomBar, useStepInView } from '@/components/ui/bottom-bar';
import { Button } from '@/components/ui/button';
import { Keypad } from '@/components/ui/keypad';
import { Notice } from '@/components/ui/notice';
import { ShapeIcon } from '@/components/ui/shapes';
import { QrScanner } from '@/components/ui/qr-scanner';
import { QrGlyph } from '@/components/ui/qr-glyph';
import { Stepper } from '@/components/ui/stepper';
import type { ServicingDraft } from '../model/check-draft';
import { ToolPicker } from './tool-picker';
import { Trans } from 'react-i18next';
import { useCheckWords } from '../model/check-words';
import { fieldError } from '@/lib/field-error';

interface ServicingFormProps {
  checkpoint: Checkpoint;
  typeCode: string;
  fluids: Fluid[];
  levelBefore: ReadingEntry;
  /** Litres to reach the mark, when the level was read on a scale. */
  toAddL: number | null;
  mark: TargetMarkName;
  existing: ServicingDraft | undefined;
  onSave: (servicing: ServicingDraft) => void;
  onCancel: () => void;
}

type Part = 'quantity' | 'fluid' | 'batch' | 'can';
/** The mark a top-up aims for: the maintenance (upper) mark or NORMAL. */
export type TargetMarkName = 'maximum' | 'normal';
type VolumeUnit = ServicingDraft['quantity']['unit'];

const volumeChoices = ['L', 'US_qt'] as const satisfies readonly VolumeUnit[];
const stepOf: Record<VolumeUnit, number> = { L: 0.1, US_qt: 0.25 };
const letters = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ'.split('');
const baseKeys = {
  mineral: 'servicing.baseMineral',
  synthetic_hydrocarbon: 'servicing.baseSyntheticHydrocarbon',
  phosphate_ester: 'servicing.basePhosphateEster',
} as const satisfies Record<Fluid['base'], string>;
const trim = (value: number) => String(Number(value.toFixed(3)));
const partKeys = {
  quantity: 'servicing.partQuantity',
  fluid: 'servicing.partFluid',
  batch: 'servicing.partBatch',
  can: 'servicing.partCan',
} as const satisfies Record<Part, string>;
const markKeys = { maximum: 'marks.maximum', normal: 'marks.normal' } as const satisfies Record<
  TargetMarkName,
  string
>;
const tabletZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;
/** The tablet's local day `back` days ago, "YYYY-MM-DD". */
const daysAgo = (back: number) => localDay(new Date(Date.now() - back * 86_400_000), tabletZone());

/**
 * Fluid added inside the check, recorded once and as measured: how much went in, which specification (another base
 * refused), which batch, the day the can was opened and the cart if one was used; then the level is re-read.
 */
export function ServicingForm({
  checkpoint,
  typeCode,
  fluids,
  levelBefore,
  toAddL,
  mark,
  existing,
  onSave,
  onCancel,
}: ServicingFormProps) {
  const { t, words } = useCheckWords();
  const markName = t(markKeys[mark]);
  const baseWords = (base: Fluid['base']) => t(baseKeys[base]);
  const [part, setPart] = useState<Part>('quantity');
  const [unit, setUnit] = useState<VolumeUnit>(existing?.quantity.unit ?? 'L');
  const [typed, setTyped] = useState(existing ? trim(existing.quantity.value) : '');
  const [spec, setSpec] = useState(existing?.fluidSpec ?? '');
  const [otherOpen, setOtherOpen] = useState(
    existing !== undefined && !fluids.some((fluid) => fluid.spec === existing.fluidSpec),
  );
  const [batch, setBatch] = useState(existing?.batch ?? '');
  const [canOpenedOn, setCanOpenedOn] = useState<string | null>(existing?.canOpenedOn ?? null);
  const [cart, setCart] = useState<string | undefined>(existing?.tool);
  const [scanning, setScanning] = useState(false);
  const refusal = useRef<HTMLDivElement>(null);
  const headingRef = useRef<HTMLDivElement>(null);
  const padRef = useRef<HTMLDivElement>(null);
  const barRef = useRef<HTMLDivElement>(null);
  // Each part starts at the top, where its question is; the amount's keypad is then brought clear of the bar.
  useLayoutEffect(() => {
    window.scrollTo({ top: 0, behavior: 'instant' });
  }, [part]);
  useStepInView(headingRef, padRef, barRef, part);

  const quantity = typed === '' || typed === '.' ? null : Number(typed);
  const quantityOk = quantity !== null && Number.isFinite(quantity) && quantity > 0 && quantity <= 100;
  const fluidCheck =
    spec.trim() === ''
      ? null
      : checkFluidAllowed({ code: typeCode, fluid: { allowed: fluids } }, spec.trim());
  const batchCheck = servicingEntrySchema.shape.batch.safeParse(batch);
  const wrongBase = fluidCheck !== null && !fluidCheck.allowed && fluidCheck.reason === 'different_base';
  // The mixing warning must be seen, not sit under the bottom bar.
  useEffect(() => {
    if (wrongBase) refusal.current?.scrollIntoView({ block: 'center' });
  }, [wrongBase, spec]);

  const typeDigit = (digit: string) => {
    if (digit === '.' && typed.includes('.')) return;
    if (typed.replace('.', '').length >= 5) return;
    setTyped(typed === '0' && digit !== '.' ? digit : typed + digit);
  };
  const switchUnit = (next: VolumeUnit) => {
    if (next === unit) return;
    if (quantityOk) setTyped(trim(convert(quantity, unit, next)));
    setUnit(next);
  };
  const addToBatch = (text: string) => setBatch((value) => (value.length < 40 ? value + text : value));

  const bar = (
    next: { label: string; enabled: boolean; go: () => void },
    back: () => void,
    backLabel = t('nav.back'),
  ) => (
    <BottomBar barRef={barRef}>
      <Button tone="neutral" size="large" onClick={back} className="min-w-[200px]">
        {backLabel}
      </Button>
      <Button tone="primary" size="large" disabled={!next.enabled} onClick={next.go} className="flex-1">
        {next.label}
      </Button>
    </BottomBar>
  );

  return (
    <section
      aria-label={t('servicing.label', { label: checkpoint.label })}
      data-testid="servicing-form"
      className="flex flex-col gap-5"
    >
      <div ref={headingRef}>
        <div className="text-[22px] font-semibold uppercase tracking-[0.1em] text-ink-muted">
          {t('servicing.heading', { part: t(partKeys[part]) })}
        </div>
        <h2 className="text-[36px] font-bold leading-tight">{checkpoint.label}</h2>
        <p className="text-lead">
          <Trans
            t={t}
            i18nKey="servicing.levelBefore"
            values={{ level: words.entry(levelBefore) }}
            components={{ strong: <strong /> }}
          />{' '}
          {toAddL !== null ? (
            // Most glasses carry marks, not a scale: the figure guides the pour, the glass decides.
            <span data-testid="servicing-estimate">
              <Trans
                t={t}
                i18nKey="servicing.estimate"
                values={{
                  amount: words.value(convert(toAddL, 'L', unit), unit, unit === 'L' ? 1 : 2),
                  mark: markName,
                }}
                components={{ amount: <strong data-testid="servicing-to-add" /> }}
              />
            </span>
          ) : (
            t('servicing.fillTo', { mark: markName })
          )}
        </p>
      </div>

      {part === 'quantity' && (
        <>
          <div ref={padRef} className="flex gap-6 portrait:flex-col">
            <div className="flex min-w-0 flex-1 flex-col gap-4">
              <div className="text-[24px] font-semibold">{t('servicing.howMuch')}</div>
              <Stepper
                name={t('servicing.quantityStepper')}
                canDecrease={quantityOk && quantity - stepOf[unit] > 0}
                onStep={(direction) =>
                  setTyped(trim(Math.max(0, (quantityOk ? quantity : 0) + direction * stepOf[unit])))
                }
              >
                <output
                  data-testid="servicing-quantity"
                  className="tabular flex items-baseline gap-3 py-3 text-[72px] font-bold leading-none"
                >
                  {typed === '' ? (
                    <span className="text-[28px] font-normal text-ink-muted">
                      {t('servicing.amountAdded')}
                    </span>
                  ) : (
                    words.typed(typed)
                  )}
                  <span className="text-[32px] font-semibold text-ink-muted">{words.unit(unit)}</span>
                </output>
              </Stepper>
              <div className="flex flex-wrap gap-3" role="group" aria-label={t('servicing.unitGroup')}>
                {volumeChoices.map((choice) => (
                  <Button
                    key={choice}
                    tone={choice === unit ? 'primary' : 'neutral'}
                    size="large"
                    aria-pressed={choice === unit}
                    aria-label={t('servicing.fluidIn', { unit: words.unit(choice) })}
                    onClick={() => switchUnit(choice)}
                  >
                    {words.unit(choice)}
                  </Button>
                ))}
              </div>
              {typed !== '' && !quantityOk && (
                <p className="text-[22px] text-caution-text">{t('servicing.amountRange')}</p>
              )}
            </div>
            <div className="w-[380px] portrait:mx-auto portrait:w-full portrait:max-w-[460px]">
              <Keypad decimal onDigit={typeDigit} onBackspace={() => setTyped(typed.slice(0, -1))} />
            </div>
          </div>
          {bar(
            { label: t('servicing.nextFluid'), enabled: quantityOk, go: () => setPart('fluid') },
            onCancel,
            t('nav.cancel'),
          )}
        </>
      )}

      {part === 'fluid' && (
        <>
          <div className="text-[24px] font-semibold">{t('servicing.whichFluid')}</div>
          <div
            className="grid grid-cols-2 gap-4 portrait:grid-cols-1"
            role="group"
            aria-label={t('servicing.approvedFluids')}
          >
            {fluids.map((fluid) => (
              <Button
                key={fluid.spec}
                tone={spec === fluid.spec && !otherOpen ? 'primary' : 'neutral'}
                size="huge"
                aria-pressed={spec === fluid.spec && !otherOpen}
                onClick={() => {
                  setOtherOpen(false);
                  setSpec(fluid.spec);
                }}
                className="flex-col"
              >
                <span>{fluid.spec}</span>
                <span className="text-[22px] font-normal">
                  {t('servicing.approvedFor', { base: baseWords(fluid.base), type: typeCode })}
                </span>
              </Button>
            ))}
            <Button
              tone={otherOpen ? 'primary' : 'neutral'}
              size="huge"
              aria-pressed={otherOpen}
              onClick={() => {
                setOtherOpen(true);
                setSpec('');
              }}
            >
              {t('servicing.other')}
            </Button>
          </div>
          {otherOpen && (
            <div className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
              <label htmlFor="other-fluid" className="text-[24px] font-semibold">
                {t('servicing.otherSpec')}
              </label>
              <input
                id="other-fluid"
                value={spec}
                onChange={(event) => setSpec(event.target.value.slice(0, 64))}
                autoComplete="off"
                autoCapitalize="characters"
                spellCheck={false}
                className="min-h-touch-lg rounded-xl border-2 border-ink-line bg-ink px-5 text-[36px] font-semibold text-paper"
              />
              <div className="flex flex-wrap gap-3" role="group" aria-label={t('servicing.otherOften')}>
                {knownFluids
                  .filter((known) => !fluids.some((fluid) => fluid.spec === known.spec))
                  .map((known) => (
                    <Button
                      key={known.spec}
                      tone={spec === known.spec ? 'primary' : 'quiet'}
                      aria-pressed={spec === known.spec}
                      onClick={() => setSpec(known.spec)}
                    >
                      {known.spec}
                    </Button>
                  ))}
              </div>
            </div>
          )}
          {fluidCheck && !fluidCheck.allowed && fluidCheck.reason === 'different_base' && (
            <div
              ref={refusal}
              role="alert"
              data-testid="fluid-refused"
              data-reason="different_base"
              className="flex items-start gap-5 rounded-xl border-4 border-warning-edge bg-warning p-5 text-white [--shape-ink:#8f1d17]"
            >
              <ShapeIcon shape="octagon" size={72} className="text-white" />
              <div>
                <div className="text-[44px] font-bold leading-tight">{t('servicing.doNotAdd')}</div>
                <div className="text-[26px] leading-snug">{fluidCheck.message}</div>
              </div>
            </div>
          )}
          {fluidCheck && !fluidCheck.allowed && fluidCheck.reason === 'not_approved' && (
            <div data-testid="fluid-refused" data-reason="not_approved">
              <Notice tone="caution" title={t('servicing.notApproved')}>
                {fluidCheck.message}
              </Notice>
            </div>
          )}
          {fluidCheck?.allowed && (
            <Notice
              tone="normal"
              title={t('servicing.approvedTitle', { spec: fluidCheck.fluid.spec, type: typeCode })}
            >
              {t('servicing.baseSentence', { base: baseWords(fluidCheck.fluid.base) })}
            </Notice>
          )}
          {bar(
            {
              label: t('servicing.nextBatch'),
              enabled: fluidCheck?.allowed === true,
              go: () => setPart('batch'),
            },
            () => setPart('quantity'),
          )}
        </>
      )}

      {part === 'batch' && (
        <>
          <div className="flex flex-wrap items-end gap-4">
            <div className="flex min-w-[320px] flex-1 flex-col gap-2">
              <label htmlFor="batch-number" className="text-[24px] font-semibold">
                {t('servicing.batchLabel')}
              </label>
              <input
                id="batch-number"
                data-testid="batch-number"
                value={batch}
                onChange={(event) => setBatch(event.target.value.toUpperCase().slice(0, 40))}
                autoComplete="off"
                autoCapitalize="characters"
                spellCheck={false}
                className="tabular min-h-touch-lg rounded-xl border-2 border-ink-line bg-ink px-5 text-[44px] font-bold tracking-[0.08em] text-paper"
              />
            </div>
            <Button tone="neutral" size="large" onClick={() => setScanning(true)}>
              <QrGlyph /> {t('servicing.scanBatch')}
            </Button>
          </div>
          {batch !== '' && !batchCheck.success && (
            <p className="text-[22px] text-caution-text">{fieldError(batchCheck.error.issues[0]?.message)}</p>
          )}
          <div className="flex gap-6 portrait:flex-col">
            <div
              className="grid flex-1 grid-cols-7 content-start gap-2"
              role="group"
              aria-label={t('servicing.letters')}
            >
              {[...letters, '-', '/'].map((letter) => (
                <button
                  key={letter}
                  type="button"
                  aria-label={
                    letter === '-' ? t('servicing.dash') : letter === '/' ? t('servicing.slash') : letter
                  }
                  onClick={() => addToBatch(letter)}
                  className="flex min-h-touch min-w-touch items-center justify-center rounded-xl border-2 border-ink-line bg-ink-raised text-[32px] font-semibold text-paper active:scale-[0.96]"
                >
                  {letter}
                </button>
              ))}
            </div>
            <div className="w-[340px] portrait:mx-auto portrait:w-full portrait:max-w-[460px]">
              <Keypad onDigit={addToBatch} onBackspace={() => setBatch((value) => value.slice(0, -1))} />
            </div>
          </div>
          {bar({ label: t('servicing.nextCan'), enabled: batchCheck.success, go: () => setPart('can') }, () =>
            setPart('fluid'),
          )}
          {scanning && (
            <QrScanner
              what={t('servicing.scanWhat')}
              onClose={() => setScanning(false)}
              onResult={(text) => {
                setScanning(false);
                setBatch(text.trim().toUpperCase().slice(0, 40));
              }}
            />
          )}
        </>
      )}

      {part === 'can' && (
        <>
          <div className="text-[24px] font-semibold">{t('servicing.whenOpened')}</div>
          <div
            className="flex flex-wrap items-center gap-4"
            role="group"
            aria-label={t('servicing.dayGroup')}
          >
            {[
              { label: t('servicing.today'), day: daysAgo(0) },
              { label: t('servicing.yesterday'), day: daysAgo(1) },
            ].map((choice) => (
              <Button
                key={choice.label}
                size="large"
                tone={canOpenedOn === choice.day ? 'primary' : 'neutral'}
                aria-pressed={canOpenedOn === choice.day}
                onClick={() => setCanOpenedOn(choice.day)}
              >
                {choice.label}
              </Button>
            ))}
            <Stepper
              name={t('servicing.dayStepper')}
              canIncrease={canOpenedOn !== null && canOpenedOn < daysAgo(0)}
              onStep={(direction) => {
                const from = canOpenedOn ?? daysAgo(1);
                const next = localDay(
                  new Date(Date.parse(`${from}T12:00:00Z`) + direction * 86_400_000),
                  'UTC',
                );
                setCanOpenedOn(next > daysAgo(0) ? daysAgo(0) : next);
              }}
            >
              <output data-testid="can-opened" className="tabular px-4 py-3 text-[36px] font-bold">
                {canOpenedOn ? calendarDay(canOpenedOn) : t('servicing.pickDay')}
              </output>
            </Stepper>
          </div>
          <div className="text-[24px] font-semibold">{t('servicing.fromCart')}</div>
          <ToolPicker what={t('servicing.topUp')} rule={topUpToolRule} value={cart} onChange={setCart} />
          {bar(
            {
              label: t('servicing.save'),
              enabled:
                canOpenedOn !== null && batchCheck.success && quantityOk && fluidCheck?.allowed === true,
              go: () => {
                if (!quantityOk || !fluidCheck?.allowed || canOpenedOn === null) return;
                onSave({
                  quantity: { value: quantity, unit },
                  fluidSpec: fluidCheck.fluid.spec,
                  batch: batch.trim(),
                  canOpenedOn,
                  ...(cart ? { tool: cart } : {}),
                  levelBefore,
                });
              },
            },
            () => setPart('batch'),
          )}
        </>
      )}
    </section>
  );
}
