import type { ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import type { CheckKind } from '@shared/schemas/limits';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { Button } from '@/components/ui/button';
import { DefectLines, defectsBesideHolds, ReleaseLine, showsRelease } from '@/components/ui/defect-lines';
import { FluidAlertLines } from '@/components/ui/airframe-lines';
import { StateBadge } from '@/components/ui/state-badge';
import { Notice } from '@/components/ui/notice';
import { checkKindLabel } from '@shared/schemas/plain';
import { ReasonItems } from '@/components/ui/reason-items';

const preFlight: CheckKind = 'pre_flight';
const otherKinds: CheckKind[] = ['ground_run', 'after_flight', 'servicing'];

/** What to do with the airframe in hand; pre-flight is the morning's job, so it is the big one. */
export function CheckKindChooser({
  airframe,
  onStart,
  now,
  children,
}: {
  airframe: AirframeSummary;
  onStart: (kind: CheckKind) => void;
  now: number;
  children?: ReactNode;
}) {
  const { t } = useTranslation('airframes');
  return (
    <section
      aria-label={t('chooser.label', { fleetNumber: airframe.fleetNumber })}
      className="flex flex-col gap-4 rounded-xl border-2 border-signal-edge bg-ink-soft p-5"
    >
      <div className="flex flex-wrap items-center gap-4">
        <h2 className="tabular text-fleet font-bold">{airframe.fleetNumber}</h2>
        <div className="text-[24px] text-ink-muted">{airframe.type.name}</div>
        <StateBadge state={airframe.state} causes={airframe.causes} size="lg" />
      </div>
      {airframe.stateReasons.length > 0 && (
        <ul
          className="flex flex-col gap-1 text-[22px]"
          aria-label={t('chooser.whyThisState')}
          data-testid="state-reasons"
        >
          <ReasonItems reasons={airframe.stateReasons} />
        </ul>
      )}
      <DefectLines defects={defectsBesideHolds(airframe)} now={now} />
      <FluidAlertLines airframe={airframe} />
      {showsRelease(airframe) && <ReleaseLine release={airframe.release} className="text-[22px]" />}
      {airframe.openHolds.length > 0 && (
        <Notice tone="warning" title={t('chooser.onHold')}>
          {t('chooser.onHoldText', { reasons: airframe.openHolds.map((hold) => hold.reason).join('; ') })}
          <span className="mt-2 flex flex-wrap gap-3">
            {airframe.openHolds.map((hold) => (
              <Link
                key={hold.id}
                to={`/kiosk/holds/${hold.id}`}
                className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-5 text-[22px] font-semibold"
              >
                {t('chooser.openHold')}
              </Link>
            ))}
          </span>
        </Notice>
      )}
      <Button tone="primary" size="huge" onClick={() => onStart(preFlight)} data-testid="start-pre_flight">
        {t('chooser.startPreFlight')}
      </Button>
      <div className="grid grid-cols-3 gap-3 portrait:grid-cols-1">
        {otherKinds.map((kind) => (
          <Button
            key={kind}
            tone="neutral"
            size="large"
            onClick={() => onStart(kind)}
            data-testid={`start-${kind}`}
          >
            {checkKindLabel(kind)}
          </Button>
        ))}
      </div>
      {children}
    </section>
  );
}
