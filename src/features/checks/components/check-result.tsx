import { formatDay } from '@shared/domain/when';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { StoredCheck } from '@shared/schemas/checks';
import { checkKindLabels } from '@shared/schemas/plain';
import { formatValue, isPressureUnit } from '@shared/domain/units';
import { DefectLines, defectsBesideHolds } from '@/components/ui/defect-lines';
import { Notice } from '@/components/ui/notice';
import { StateBadge, stateWords } from '@/components/ui/state-badge';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { localTime } from '@/lib/when';
import { photoUrl } from '../api/upload-photo';
import { describeEntry, describeReading } from '@/lib/describe-entry';
import { describeContext } from '@shared/domain/words';

/**
 * The airframe's state after this record, as the board and the pilot see it (the same derivation on the server),
 * so the mechanic is never told something milder than the board shows.
 */
function StateAfter({ airframe, now }: { airframe: AirframeSummary | undefined; now: number }) {
  if (!airframe)
    return <p className="text-[24px] text-ink-muted">Reading the airframe's state from the server…</p>;
  return (
    <section
      aria-label="Airframe state now"
      data-testid="state-after-check"
      data-state={airframe.state}
      className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
    >
      <div className="flex flex-wrap items-center gap-4">
        <span className="text-[26px] font-semibold">{airframe.fleetNumber} is now</span>
        <StateBadge state={airframe.state} causes={airframe.causes} size="lg" />
      </div>
      {airframe.stateReasons.length > 0 && (
        <ul className="flex flex-col gap-1 text-[22px]" aria-label="Why this state">
          {airframe.stateReasons.map((reason) => (
            <li key={reason}>{reason}</li>
          ))}
        </ul>
      )}
      <DefectLines defects={defectsBesideHolds(airframe)} now={now} />
    </section>
  );
}

/** What to do next, titled with the airframe's state in words: "Unserviceable: service needed". */
function NextStep({ check, airframe }: { check: StoredCheck; airframe: AirframeSummary | undefined }) {
  const onHold = check.holdOpened || check.verdict === 'out_of_limits';
  const state = airframe ? stateWords(airframe.state, airframe.causes) : null;
  if (onHold) {
    return (
      <Notice tone="warning" big title={`${state ?? 'Unserviceable: on hold'}. The shift lead is told.`}>
        Do not release or fly it. Before a re-check: correct each red reading as its Next line says, following
        the approved maintenance data, then start a new check of the same kind. The hold stays until a shift
        lead (not you) countersigns the release.
      </Notice>
    );
  }
  if (check.verdict === 'service') {
    return (
      <Notice tone="warning" big title={`${state ?? 'Unserviceable: service needed'}. Do not fly it.`}>
        Do the servicing shown below with the approved fluid, then sign a servicing check (or a new check of
        the same kind) with the level in limits. Until then the pilot cannot accept it.
      </Notice>
    );
  }
  if (airframe?.state === 'unserviceable') {
    const fromNote = check.note
      ? airframe.defects.find((d) => d.description === check.note?.trim())
      : undefined;
    return (
      <Notice
        tone="warning"
        big
        title={`Every reading in limits, but ${airframe.fleetNumber} is ${state?.toLowerCase() ?? 'unserviceable'}`}
      >
        The record is stored.{' '}
        {fromNote
          ? `Your defect note is defect ${fromNote.number} in the tech log: until certifying staff rectify or defer it, the pilot cannot accept the aircraft.`
          : 'What keeps the airframe unserviceable is listed below.'}
      </Notice>
    );
  }
  return (
    <Notice tone="normal" big title="Every reading in limits">
      The record is stored.
      {check.note ? ' Your defect note is now a defect in the tech log.' : ''} A pilot still accepts the
      aircraft before flight.
    </Notice>
  );
}

/** The signed record as the server stored and judged it: every verdict, the airframe's state, and what happens next. */
export function CheckResult({
  check,
  airframe,
  now = Date.now(),
}: {
  check: StoredCheck;
  airframe?: AirframeSummary | undefined;
  now?: number;
}) {
  const servicingOf = (code: string) => check.servicing.find((entry) => entry.code === code);
  return (
    <div className="flex flex-col gap-5" data-testid="check-result" data-verdict={check.verdict}>
      <div className="flex flex-wrap items-center gap-5">
        <h2 className="text-[40px] font-bold">
          {check.airframe.fleetNumber} {checkKindLabels[check.kind]} signed
        </h2>
        <VerdictBadge verdict={check.verdict} size="lg" />
      </div>
      <p className="text-[22px] text-ink-muted">
        Signed by {check.signedBy.name} (badge {check.signedBy.badgeNumber}) at {localTime(check.signedAt)} ·{' '}
        {check.limitsVersion.typeCode} limits v{check.limitsVersion.version} ·{' '}
        {describeContext(check.context)}
      </p>
      <NextStep check={check} airframe={airframe} />
      <StateAfter airframe={airframe} now={now} />
      <ul className="flex flex-col gap-3" aria-label="Verdicts">
        {check.readings.map((reading) => (
          <li
            key={reading.code}
            data-testid={`result-${reading.code}`}
            className="flex flex-wrap items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft p-3"
          >
            <div className="min-w-[240px] flex-1">
              <div className="text-[24px] font-semibold">{reading.label}</div>
              <div className="text-[22px]">{reading.message}</div>
              {reading.action !== 'None.' && (
                <div className="text-[22px] text-ink-muted">Next: {reading.action}</div>
              )}
              {reading.expected !== null && reading.unit !== null && isPressureUnit(reading.unit) && (
                <div className="text-[22px] text-ink-muted">
                  Expected {formatValue(reading.expected, reading.unit)} at this temperature
                </div>
              )}
            </div>
            <span className="tabular text-[30px] font-bold">
              {describeReading(reading.entry, reading.verdict)}
            </span>
            <VerdictBadge verdict={reading.verdict} />
            {servicingOf(reading.code) && (
              <div
                data-testid={`result-fluid-${reading.code}`}
                className="w-full text-[22px] font-semibold text-signal-text"
              >
                Fluid added: {formatValue(servicingOf(reading.code)!.quantityL, 'L', 2)}{' '}
                {servicingOf(reading.code)!.fluidSpec}, batch {servicingOf(reading.code)!.batch} · level
                before {describeEntry(servicingOf(reading.code)!.levelBefore)}
                {servicingOf(reading.code)!.tool && <> · cart {servicingOf(reading.code)!.tool!.number}</>}
              </div>
            )}
            {reading.tool && (
              <div data-testid={`result-tool-${reading.code}`} className="w-full text-[22px] text-ink-muted">
                Read with {reading.tool.number}, {reading.tool.description} (calibration due{' '}
                {formatDay(reading.tool.calibrationDue)})
              </div>
            )}
            {reading.photos.length > 0 && (
              <div className="flex w-full flex-wrap gap-2" aria-label={`Photos of ${reading.label}`}>
                {reading.photos.map((photo, index) => (
                  <img
                    key={photo.id}
                    src={photoUrl(photo.id)}
                    alt={`Photo ${index + 1} of ${reading.label}`}
                    className="h-[80px] w-[80px] rounded-md border-2 border-ink-line object-cover"
                  />
                ))}
              </div>
            )}
          </li>
        ))}
      </ul>
      {check.note && (
        <section aria-label="Defect note" className="rounded-xl border-2 border-ink-line bg-ink-soft p-4">
          <h3 className="text-[24px] font-semibold">Defect note</h3>
          {/* Whatever was typed is shown as text, never as markup. */}
          <p data-testid="result-note" className="whitespace-pre-wrap break-words text-[24px]">
            {check.note}
          </p>
        </section>
      )}
    </div>
  );
}
