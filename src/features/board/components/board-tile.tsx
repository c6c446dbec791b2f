import { memo, useLayoutEffect, useRef, type RefObject } from 'react';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { checkKindLabels } from '@shared/schemas/plain';
import {
  DefectLines,
  defectsBesideHolds,
  findingReasons,
  ReleaseLine,
  showsRelease,
} from '@/components/ui/defect-lines';
import { FluidAlertLines } from '@/components/ui/airframe-lines';
import { StateBadge, stateEdgeTop } from '@/components/ui/state-badge';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { localTime, timeLeft } from '@/lib/when';
import { useTranslation } from 'react-i18next';
import i18next from 'i18next';

export type BoardTheme = 'dark' | 'light';

export function countdown(iso: string, now: number): { text: string; overdue: boolean } {
  const left = timeLeft(iso, now);
  const text = i18next.t(left.past ? 'board:tile.overdueBy' : 'board:tile.dueIn', { time: left.text });
  return { text, overdue: left.past };
}

/**
 * On a crowded board a tile has less room than its lines: the lines that do not fit whole are hidden instead of
 * being cut through the middle, which reads from across the hangar as a smudge. The header and the lines marked
 * `data-keep` (what keeps the airframe on the ground) are never hidden: the tile is at least their height, and a
 * board too crowded for that scrolls (the grid's rows grow to it) instead.
 *
 * Only the tiles in (or near) view are fitted. A tile out of view is drawn by the browser as a box of its last size
 * (`content-visibility: auto`), its lines left unlaid; measuring its lines would lay them all out, which on a board
 * of a hundred tiles held a slow tablet's screen for half a second. It is fitted when it comes near the view.
 *
 * Every tile waiting to be fitted is fitted in one pass, all measuring before all writing, so the browser lays the
 * board out at most twice a pass, not twice a tile: a tile measured right after another's write makes the browser
 * lay out the whole grid again.
 */
function fitTiles(tiles: readonly HTMLElement[]) {
  const connected = tiles.filter((tile) => tile.isConnected);
  if (!wideBoard.matches) {
    // Nothing to measure: every tile has its room. What a wider window hid is shown again.
    for (const tile of connected) unfit(tile);
    return;
  }
  // One layout places every tile; a tile out of view costs only its box here.
  const margin = window.innerHeight / 2;
  const shown = connected.filter((tile) => {
    const box = tile.getBoundingClientRect();
    const near = box.bottom > -margin && box.top < window.innerHeight + margin;
    if (near) unfitted.delete(tile);
    else unfitted.add(tile);
    return near;
  });
  const leastHeights = shown.map((tile) => {
    const kept = tile.querySelectorAll(':scope > header, :scope > [data-keep]');
    const lastKept = kept[kept.length - 1];
    if (!lastKept) return null;
    const style = getComputedStyle(tile);
    const below = parseFloat(style.paddingBottom) + parseFloat(style.borderBottomWidth);
    const box = tile.getBoundingClientRect();
    const least = Math.ceil(lastKept.getBoundingClientRect().bottom - box.top + below);
    // A tile that already has the room and no least height yet is left alone: no write, no second layout (a roomy
    // board is drawn with none). One that is squeezed later is fitted when its size changes.
    return tile.style.minHeight === '' && box.height >= least ? null : `${least}px`;
  });
  shown.forEach((tile, i) => {
    const least = leastHeights[i];
    if (least && tile.style.minHeight !== least) tile.style.minHeight = least;
  });
  // Visibility leaves the layout alone, so each line is measured where it stands, and the writes below cost no
  // second layout. Written only when it changes.
  const visibilities = shown.flatMap((tile) => {
    const bottom = tile.getBoundingClientRect().bottom - parseFloat(getComputedStyle(tile).borderBottomWidth);
    return (Array.from(tile.children) as HTMLElement[])
      .filter((line) => line.tagName !== 'HEADER' && line.dataset.keep === undefined)
      .map((line) => [line, line.getBoundingClientRect().bottom > bottom + 1 ? 'hidden' : ''] as const);
  });
  for (const [line, visibility] of visibilities)
    if (line.style.visibility !== visibility) line.style.visibility = visibility;
}

/**
 * Tailwind's `lg` (1024 px), where the board takes four columns and the screen's height. Below it the board is as
 * tall as its tiles and the grid's rows grow to the tallest tile, so every tile has its room: a phone or an upright
 * tablet fits nothing, and measures nothing.
 */
export const wideBoard = window.matchMedia('(min-width: 1024px)');

function unfit(tile: HTMLElement) {
  unfitted.delete(tile);
  if (tile.style.minHeight !== '') tile.style.minHeight = '';
  for (const line of Array.from(tile.children) as HTMLElement[])
    if (line.style.visibility !== '') line.style.visibility = '';
}

/** Tiles drawn or resized while out of view: fitted when they come near it. */
const unfitted = new Set<HTMLElement>();

// Tiles drawn in one commit are fitted together once it ends (a microtask, still before the screen is painted);
// one observer for every tile hands over all the tiles a resize changed at once, and one tells which come into view.
const waiting = new Set<HTMLElement>();
function fitAfterCommit(tile: HTMLElement) {
  if (waiting.size === 0) {
    queueMicrotask(() => {
      const tiles = [...waiting];
      waiting.clear();
      fitTiles(tiles);
    });
  }
  waiting.add(tile);
}
let resizes: ResizeObserver | undefined;
const resizeObserver = () =>
  (resizes ??= new ResizeObserver((entries) => fitTiles(entries.map((e) => e.target as HTMLElement))));
let sights: IntersectionObserver | undefined;
const sightObserver = () =>
  (sights ??= new IntersectionObserver(
    (entries) =>
      fitTiles(
        entries
          .filter((e) => e.isIntersecting && unfitted.has(e.target as HTMLElement))
          .map((e) => e.target as HTMLElement),
      ),
    { rootMargin: '50% 0px' },
  ));

function useWholeLinesOnly(ref: RefObject<HTMLElement | null>) {
  // After each drawing (the lines may have changed), and when the tile's size changes or it comes into view.
  useLayoutEffect(() => {
    if (ref.current) fitAfterCommit(ref.current);
  });
  useLayoutEffect(() => {
    const tile = ref.current;
    if (!tile) return;
    resizeObserver().observe(tile);
    sightObserver().observe(tile);
    return () => {
      resizeObserver().unobserve(tile);
      sightObserver().unobserve(tile);
      unfitted.delete(tile);
    };
  }, [ref]);
}

function BoardTileView({
  airframe,
  theme,
  now,
}: {
  airframe: AirframeSummary;
  theme: BoardTheme;
  now: number;
}) {
  const { t } = useTranslation('board');
  const dark = theme === 'dark';
  const muted = dark ? 'text-ink-muted' : 'text-paper-muted';
  const due = airframe.nextDue ? countdown(airframe.nextDue.at, now) : null;
  const tile = useRef<HTMLElement>(null);
  useWholeLinesOnly(tile);
  return (
    <article
      ref={tile}
      data-testid={`board-${airframe.fleetNumber}`}
      data-state={airframe.state}
      data-causes={airframe.causes.join(' ')}
      className={`@container flex min-w-0 flex-col gap-2 overflow-hidden rounded-2xl [contain-intrinsic-size:auto_20rem] [content-visibility:auto] [overflow-wrap:anywhere] border-2 border-t-[14px] p-4 ${stateEdgeTop[airframe.state]} ${airframe.state === 'unserviceable' ? 'ring-4 ring-warning-edge' : ''} ${dark ? 'border-ink-line bg-ink-soft text-paper' : 'border-paper-line bg-paper-card text-on-fill'}`}
    >
      {/* Words break only below the header: its state word and fleet number stay whole (they move down instead). */}
      <header className="flex flex-wrap items-center justify-between gap-x-3 gap-y-2 [overflow-wrap:normal]">
        {/* Sized by the tile's width (`@container`): a fleet number is never broken across lines ("T-" over "03"). */}
        <div className="flex min-w-0 items-end gap-3">
          <h2 className="tabular whitespace-nowrap text-[clamp(44px,20cqi,88px)] font-bold leading-[0.9]">
            {airframe.fleetNumber}
          </h2>
          <span className={`min-w-0 pb-1 text-[clamp(16px,5.5cqi,22px)] leading-tight ${muted}`}>
            {airframe.registration && (
              <>
                <span className="font-semibold" data-testid="board-registration">
                  {airframe.registration}
                </span>
                <br />
              </>
            )}
            {airframe.type.code}
            <br />
            {airframe.base.name}
          </span>
        </div>
        <StateBadge state={airframe.state} causes={airframe.causes} size="tile" />
      </header>
      {/* What keeps it on the ground comes first; the rest may be cut off on a crowded board, never this. */}
      {airframe.openHolds.length > 0 && (
        <ul
          data-keep
          className={`flex flex-col gap-1 rounded-lg p-2 text-[clamp(20px,7.5cqi,28px)] font-semibold leading-snug @sm:p-3 ${dark ? 'bg-ink text-warning-text' : 'bg-warning-tint text-warning'}`}
          aria-label={t('tile.openHolds')}
        >
          {airframe.openHolds.map((hold) => (
            // Two lines read from across the hangar; the lead desk has the whole reason.
            <li key={hold.id} className="line-clamp-2" title={hold.reason} data-server-words>
              {t('tile.hold', { reason: hold.reason })}
            </li>
          ))}
        </ul>
      )}
      {findingReasons(airframe).length > 0 && (
        <ul
          data-keep
          className={`flex flex-col gap-1 rounded-lg p-2 text-[clamp(19px,7cqi,26px)] font-semibold leading-snug @sm:p-3 ${dark ? 'bg-ink text-warning-text' : 'bg-warning-tint text-warning'}`}
          aria-label={t('tile.findings')}
          data-testid="board-findings"
        >
          {findingReasons(airframe).map((reason) => (
            <li key={reason} className="line-clamp-2" title={reason}>
              {reason}
            </li>
          ))}
        </ul>
      )}
      <DefectLines
        defects={defectsBesideHolds(airframe)}
        now={now}
        theme={theme}
        size="lg"
        timeZone={airframe.base.timeZone}
      />
      <FluidAlertLines airframe={airframe} theme={theme} className="text-[26px]" />
      {showsRelease(airframe) && (
        <ReleaseLine
          release={airframe.release}
          theme={theme}
          className="text-[26px]"
          timeZone={airframe.base.timeZone}
        />
      )}
      {airframe.nextDue && due && (
        <div
          className={`text-[28px] font-semibold ${due.overdue ? (dark ? 'text-caution-text' : 'text-caution') : ''}`}
        >
          {checkKindLabels[airframe.nextDue.kind]} {due.text}
        </div>
      )}
      <div className="text-[26px] leading-snug">
        {airframe.lastCheck ? (
          <div className="flex flex-wrap items-center gap-3">
            <span>
              <strong>{checkKindLabels[airframe.lastCheck.kind]}</strong>{' '}
              {localTime(airframe.lastCheck.signedAt, airframe.base.timeZone)} · {airframe.lastCheck.signedBy}
            </span>
            <VerdictBadge verdict={airframe.lastCheck.verdict} />
          </div>
        ) : (
          <span className={muted}>{t('tile.noCheck')}</span>
        )}
      </div>
      {airframe.lastAcceptance && (
        <div
          data-testid="board-acceptance"
          className={`text-[26px] font-semibold ${dark ? 'text-normal-text' : 'text-normal'}`}
        >
          {t('tile.acceptedBy', { name: airframe.lastAcceptance.by })}{' '}
          {localTime(airframe.lastAcceptance.at, airframe.base.timeZone)}
        </div>
      )}
    </article>
  );
}

/** Drawn again only when its airframe, the theme or the clock changes, not on every answer or stream event. */
export const BoardTile = memo(BoardTileView);
