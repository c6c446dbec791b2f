import {
  airframeStateLabels,
  causeLabels,
  type AirframeState,
  type UnserviceableCause,
} from '@shared/schemas/airframes';
import { ShapeIcon, stateShape } from './shapes';

// Unserviceable is red with the stop octagon; "Released" is the filled green tick and "Checks in limits" only its
// green outline on a dark pill, so a lead never reads a release into an airframe that has none. "Check due" keeps
// the amber clock: a check whose time ran out is not a finding.
const darkTones: Record<AirframeState, string> = {
  unserviceable: 'bg-warning text-white border-2 border-warning-edge [--shape-ink:#8f1d17]',
  released: 'bg-normal-bright text-on-fill [--shape-ink:#3ecf6a]',
  checks_in_limits: 'bg-ink-raised text-normal-text border-2 border-normal-edge',
  due: 'bg-caution-bright text-on-fill [--shape-ink:#ffb81c]',
  in_progress: 'bg-signal-bright text-on-fill [--shape-ink:#5aa9ff]',
  not_checked: 'bg-ink-raised text-paper border-2 border-ink-line [--shape-ink:var(--gw-ink-raised)]',
};

/** The coloured edge of a tile, by state: top edge on the board, left edge on the kiosk and pilot lists. */
export const stateEdgeTop: Record<AirframeState, string> = {
  unserviceable: 'border-t-warning-bright',
  released: 'border-t-normal-bright',
  checks_in_limits: 'border-t-normal',
  due: 'border-t-caution-bright',
  in_progress: 'border-t-signal-bright',
  not_checked: 'border-t-ink-line',
};
export const stateEdgeLeft: Record<AirframeState, string> = {
  unserviceable: 'border-l-warning-edge',
  released: 'border-l-normal-edge',
  checks_in_limits: 'border-l-normal',
  due: 'border-l-caution-edge',
  in_progress: 'border-l-signal-edge',
  not_checked: 'border-l-ink-line',
};

/** "Service needed · Open defect": the causes people read next to "Unserviceable". */
export const causeWords = (causes: readonly UnserviceableCause[]) =>
  causes.map((cause) => causeLabels[cause]).join(' · ');

/** The state in one line of words, as a result screen or a message says it: "Unserviceable: service needed". */
export function stateWords(state: AirframeState, causes: readonly UnserviceableCause[] = []): string {
  if (state !== 'unserviceable' || causes.length === 0) return airframeStateLabels[state];
  return `${airframeStateLabels[state]}: ${causes.map((c) => causeLabels[c].toLowerCase()).join(', ')}`;
}

const sizes = {
  md: { box: 'px-3 py-1.5 text-[22px] gap-2', cause: 'text-[20px]', icon: 26 },
  lg: { box: 'px-4 py-2 text-[30px] gap-3', cause: 'text-[26px]', icon: 36 },
  xl: { box: 'px-5 py-3 text-[40px] gap-3', cause: 'text-[32px]', icon: 46 },
  // A board tile: as large as lg on a wide tile, smaller on a narrow one (it reads its tile's width, `@container`),
  // so the state word is never cut on a tablet-sized board.
  tile: {
    box: 'max-w-full px-3 py-1.5 text-[clamp(20px,9cqi,30px)] gap-2',
    cause: 'text-[clamp(17px,7.5cqi,26px)]',
    icon: 32,
  },
} as const;

/**
 * An airframe's state as word + shape + colour. An unserviceable airframe always names its causes inside the same
 * badge, so it cannot be shown without them.
 */
export function StateBadge({
  state,
  causes = [],
  size = 'md',
}: {
  state: AirframeState;
  causes?: readonly UnserviceableCause[];
  size?: keyof typeof sizes;
}) {
  const s = sizes[size];
  const named = state === 'unserviceable' && causes.length > 0;
  return (
    <span
      data-testid="airframe-state"
      data-state={state}
      data-causes={causes.join(' ')}
      className={`inline-flex items-center rounded-lg font-bold ${darkTones[state]} ${s.box}`}
    >
      <ShapeIcon shape={stateShape[state]} size={s.icon} />
      <span className="flex flex-col leading-tight">
        <span className="uppercase tracking-wide">
          {airframeStateLabels[state]}
          {named && <span className="sr-only">{': '}</span>}
        </span>
        {named && (
          <span className={`font-semibold ${s.cause}`} data-testid="airframe-causes">
            {causeWords(causes)}
          </span>
        )}
      </span>
    </span>
  );
}
