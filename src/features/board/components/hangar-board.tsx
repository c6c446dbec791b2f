import { useEffect, useState } from 'react';
import { useNow } from '@/lib/use-now';
import { ApiRequestError, errorMessage } from '@/lib/api-client';
import { LimitsNotice } from '@/components/ui/limits-notice';
import { ShapeIcon } from '@/components/ui/shapes';
import { isDeadBoardLink, useBoard } from '../api/get-board';
import { useBoardEvents } from '../api/use-board-events';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { BoardTile, wideBoard, type BoardTheme } from './board-tile';
import { localTime } from '@/lib/when';
import { useTranslation } from 'react-i18next';

const themeKey = 'gw.board.theme';

/** A TV set to a language by its link (?lang=de) keeps it on the way to the sign-in page. */
function withLanguage(href: string): string {
  const language = new URLSearchParams(window.location.search).get('lang');
  if (!language) return href;
  return `${href}${href.includes('?') ? '&' : '?'}lang=${encodeURIComponent(language)}`;
}
const staleAfterMs = 20_000;

/**
 * `boardToken`: a read-only board link for a TV with nobody signed in. `bases`: the base codes to show
 * (`/board?base=NP,HH`); a board link shows no more than its own bases.
 */
export function HangarBoard({
  signInHref,
  boardToken = null,
  bases = null,
}: {
  signInHref: string;
  boardToken?: string | null;
  bases?: string | null;
}) {
  const { t } = useTranslation('board');
  const [theme, setTheme] = useState<BoardTheme>(() =>
    localStorage.getItem(themeKey) === 'light' ? 'light' : 'dark',
  );
  useEffect(() => localStorage.setItem(themeKey, theme), [theme]);
  // The first date a page writes makes the browser load its calendar and zone data (about 15 ms, 60 ms on a slow
  // tablet); written while the board waits for its airframes, not in the middle of drawing the first tiles.
  useEffect(() => {
    const timer = window.setTimeout(() => localTime(Date.now()), 0);
    return () => window.clearTimeout(timer);
  }, []);
  // A revoked link answers the stream with 401, and EventSource does not retry a refused stream by itself.
  const { streaming } = useBoardEvents(true, boardToken);
  const board = useBoard(!streaming, boardToken, bases);
  const now = useNow(5_000);

  const dark = theme === 'dark';
  const deadLink = isDeadBoardLink(board.error);
  const unauthorised = board.error instanceof ApiRequestError && board.error.status === 401 && !deadLink;
  // A board asked for a base that does not exist, or one its link does not show: asking again will not help, and
  // the server is not lost.
  const refused =
    board.error instanceof ApiRequestError &&
    (board.error.status === 400 || board.error.status === 403) &&
    !deadLink;
  const updatedAt = board.dataUpdatedAt;
  // The board's own clock: the zone its airframes' bases share, else UTC (each tile names its base's zone).
  const zones = new Set((board.data ?? []).map((airframe) => airframe.base.timeZone));
  const boardZone = zones.size === 1 ? [...zones][0] : 'UTC';
  // Which bases the tiles stand at, named in the header so a lead across the room knows whose board it is. Only on
  // a hangar-sized screen: on a tablet the extra header line took the height the tiles' state badges need.
  const baseNames = [...new Set((board.data ?? []).map((airframe) => airframe.base.name))];
  const stale = (board.isError && !refused) || (updatedAt > 0 && now - updatedAt > staleAfterMs);
  const unserviceable = board.data?.filter((airframe) => airframe.state === 'unserviceable').length ?? 0;
  // Until the first answer only the title and the loading line are drawn: the header's other parts and the notice
  // appear with the tiles instead of being pushed about by them (a layout shift on every TV and phone).
  const loading = board.isPending && !board.isError;

  return (
    <main
      className={`flex min-h-dvh flex-col gap-4 px-6 py-4 lg:h-dvh ${dark ? 'bg-ink text-paper' : 'bg-paper text-on-fill'}`}
    >
      {/* While the server is lost the warning takes the header's place, so the tiles keep their room. */}
      {stale && !unauthorised && !deadLink ? (
        <div
          role="alert"
          data-testid="board-stale"
          className="flex min-h-touch items-center gap-4 rounded-xl border-4 border-caution-edge bg-caution-bright px-4 py-2 text-[32px] font-bold text-on-fill [--shape-ink:#ffb81c]"
        >
          <ShapeIcon shape="triangle" size={48} />
          {t('stale', { at: updatedAt > 0 ? localTime(updatedAt, boardZone) : t('never') })}
          <span className="ml-auto text-[24px] font-semibold" data-testid="board-updated">
            {t('checkingEvery')}
          </span>
        </div>
      ) : (
        <header className="flex flex-wrap items-center gap-x-4 gap-y-2 2xl:gap-6">
          <h1 className="text-[40px] font-bold leading-none 2xl:text-[48px]">{t('title')}</h1>
          {baseNames.length > 0 && baseNames.length <= 3 && (
            <span data-testid="board-bases" className="hidden text-[34px] font-semibold 2xl:inline">
              {baseNames.join(' · ')}
            </span>
          )}
          {board.data && (
            <span
              data-testid="board-count"
              className={`text-[26px] font-semibold 2xl:text-[30px] ${unserviceable > 0 ? (dark ? 'text-warning-text' : 'text-warning') : ''}`}
            >
              {unserviceable > 0 ? t('unserviceable', { count: unserviceable }) : t('noneUnserviceable')} ·{' '}
              {t('airframes', { count: board.data.length })}
            </span>
          )}
          {!loading && (
            <span
              className={`ml-auto text-[22px] 2xl:text-[26px] ${deadLink ? 'invisible' : ''}`}
              data-testid="board-updated"
            >
              {updatedAt > 0 ? t('updated', { at: localTime(updatedAt, boardZone) }) : t('notLoaded')} ·{' '}
              {/* Both words hold their place, the one not in force unseen: when the stream comes up the line keeps
                  its width, so a header that wraps on a narrow screen does not move the tiles. */}
              <span className="inline-grid">
                <span className={`[grid-area:1/1] ${streaming ? '' : 'invisible'}`}>{t('live')}</span>
                <span className={`[grid-area:1/1] ${streaming ? 'invisible' : ''}`}>
                  {t('checkingEvery')}
                </span>
              </span>
            </span>
          )}
        </header>
      )}

      {deadLink && (
        <div
          role="alert"
          data-testid="board-link-dead"
          className="flex flex-1 flex-col items-start justify-center gap-6 rounded-2xl border-8 border-warning-edge p-10"
        >
          <span
            className={`flex items-center gap-6 text-[96px] font-bold leading-none ${dark ? 'text-warning-text' : 'text-warning'}`}
          >
            <ShapeIcon shape="octagon" size={110} />
            {board.error instanceof ApiRequestError && board.error.code === 'board_link_revoked'
              ? t('linkRevoked')
              : t('linkUnknown')}
          </span>
          <span className="text-[48px] font-semibold leading-tight">{t('linkDead')}</span>
          <span className="text-[40px] leading-tight">{errorMessage(board.error)}</span>
        </div>
      )}
      {unauthorised && (
        <div role="alert" className="rounded-xl border-4 border-caution-edge p-6 text-[32px]">
          {t('needsSignIn')}{' '}
          <a className="font-bold underline" href={withLanguage(signInHref)}>
            {t('signIn')}
          </a>
        </div>
      )}
      {loading && <p className="text-[32px]">{t('loading')}</p>}
      {refused && (
        <div
          role="alert"
          data-testid="board-refused"
          className="rounded-xl border-4 border-caution-edge p-6 text-[32px]"
        >
          {errorMessage(board.error)}
        </div>
      )}
      {board.isError && !unauthorised && !deadLink && !refused && !board.data && (
        <p className="text-[28px]">{errorMessage(board.error)}</p>
      )}

      {board.data && !deadLink && (
        <section
          className={`-m-1 grid min-h-0 flex-1 grid-cols-2 auto-rows-[1fr] gap-4 overflow-y-auto p-1 lg:grid-cols-4 ${stale ? 'opacity-80' : ''}`}
          aria-label={t('airframesLabel')}
          // It scrolls when the tiles do not fit: a keyboard can reach and scroll it too.
          tabIndex={0}
        >
          <BoardTiles airframes={board.data} theme={theme} now={now} />
        </section>
      )}
      {!loading && (
        // The theme is chosen once per screen: its button sits down here, so the header keeps one line on a TV.
        <footer className={`flex items-center gap-4 ${dark ? '' : 'text-paper-muted'}`}>
          <LimitsNotice tone={dark ? 'dark' : 'light'} />
          <button
            type="button"
            onClick={() => setTheme(dark ? 'light' : 'dark')}
            className={`ml-auto min-h-touch min-w-touch shrink-0 rounded-xl border-2 px-4 text-[20px] font-semibold 2xl:px-5 2xl:text-[22px] ${dark ? 'border-ink-line bg-ink-raised text-paper' : 'border-paper-line bg-paper-card text-on-fill'}`}
          >
            {dark ? t('lightTheme') : t('darkTheme')}
          </button>
        </footer>
      )}
    </main>
  );
}

/**
 * About as many tiles as the screen shows before it scrolls: two columns below 1024 px wide and four above (the
 * grid's), in rows of at least 240 px. A tile the first drawing misses is drawn a moment later, below the others.
 */
const firstTiles = () => (wideBoard.matches ? 4 : 2) * Math.ceil(window.innerHeight / 240);
/** Tiles drawn in each later piece: a few milliseconds of a slow tablet's time. */
const tilesPerPiece = 4;

/**
 * The first screenful of tiles is drawn at once; the rest of a crowded board follows a few tiles at a time, each
 * piece a task of its own that a tap or a paint can come between, instead of one drawing that held a slow tablet's
 * screen for a third of a second. Later answers redraw only the tiles that changed.
 */
function BoardTiles({
  airframes,
  theme,
  now,
}: {
  airframes: readonly AirframeSummary[];
  theme: BoardTheme;
  now: number;
}) {
  const [drawn, setDrawn] = useState(() => firstTiles());
  const more = drawn < airframes.length;
  useEffect(() => {
    if (!more) return;
    const timer = window.setTimeout(() => setDrawn((count) => count + tilesPerPiece), 0);
    return () => window.clearTimeout(timer);
  }, [drawn, more]);
  return airframes
    .slice(0, drawn)
    .map((airframe) => <BoardTile key={airframe.id} airframe={airframe} theme={theme} now={now} />);
}
