import { useEffect, useState } from 'react';
import { useNow } from '@/lib/use-now';
import { ApiRequestError, errorMessage } from '@/lib/api-client';
import { LimitsNotice } from '@/components/ui/limits-notice';
import { ShapeIcon } from '@/components/ui/shapes';
import { isDeadBoardLink, useBoard } from '../api/get-board';
import { useBoardEvents } from '../api/use-board-events';
import { BoardTile, type BoardTheme } from './board-tile';
import { localTime } from '@/lib/when';

const themeKey = 'gw.board.theme';
const staleAfterMs = 20_000;

/** `boardToken`: a read-only board link for a TV with nobody signed in. */
export function HangarBoard({
  signInHref,
  boardToken = null,
}: {
  signInHref: string;
  boardToken?: string | null;
}) {
  const [theme, setTheme] = useState<BoardTheme>(() =>
    localStorage.getItem(themeKey) === 'light' ? 'light' : 'dark',
  );
  useEffect(() => localStorage.setItem(themeKey, theme), [theme]);
  // A revoked link answers the stream with 401, and EventSource does not retry a refused stream by itself.
  const { streaming } = useBoardEvents(true, boardToken);
  const board = useBoard(!streaming, boardToken);
  const now = useNow(5_000);

  const dark = theme === 'dark';
  const deadLink = isDeadBoardLink(board.error);
  const unauthorised = board.error instanceof ApiRequestError && board.error.status === 401 && !deadLink;
  const updatedAt = board.dataUpdatedAt;
  // The board's own clock: the zone its airframes' bases share, else UTC (each tile names its base's zone).
  const zones = new Set((board.data ?? []).map((airframe) => airframe.base.timeZone));
  const boardZone = zones.size === 1 ? [...zones][0] : 'UTC';
  const stale = board.isError || (updatedAt > 0 && now - updatedAt > staleAfterMs);
  const unserviceable = board.data?.filter((airframe) => airframe.state === 'unserviceable').length ?? 0;
  // Until the first answer only the title and the loading line are drawn: the header's other parts and the notice
  // appear with the tiles instead of being pushed about by them (a layout shift on every TV and phone).
  const loading = board.isPending && !board.isError;

  return (
    <div
      className={`flex min-h-dvh flex-col gap-4 px-6 py-4 lg:h-dvh ${dark ? 'bg-ink text-paper' : 'bg-paper text-ink'}`}
    >
      {/* While the server is lost the warning takes the header's place, so the tiles keep their room. */}
      {stale && !unauthorised && !deadLink ? (
        <div
          role="alert"
          data-testid="board-stale"
          className="flex min-h-touch items-center gap-4 rounded-xl border-4 border-caution-bright bg-caution-bright px-4 py-2 text-[32px] font-bold text-ink [--shape-ink:#ffb81c]"
        >
          <ShapeIcon shape="triangle" size={48} />
          STALE: the server cannot be reached. Shown as of{' '}
          {updatedAt > 0 ? localTime(updatedAt, boardZone) : 'never'}; do not rely on it.
          <span className="ml-auto text-[24px] font-semibold" data-testid="board-updated">
            checking every 5 s
          </span>
        </div>
      ) : (
        <header className="flex flex-wrap items-center gap-6">
          <h1 className="text-[48px] font-bold leading-none">Hangar board</h1>
          {board.data && (
            <span
              data-testid="board-count"
              className={`text-[30px] font-semibold ${unserviceable > 0 ? (dark ? 'text-warning-text' : 'text-warning') : ''}`}
            >
              {unserviceable > 0 ? `${unserviceable} unserviceable` : 'None unserviceable'} ·{' '}
              {board.data.length} airframes
            </span>
          )}
          {!loading && (
            <>
              <span
                className={`ml-auto text-[26px] ${deadLink ? 'invisible' : ''}`}
                data-testid="board-updated"
              >
                {updatedAt > 0 ? `Updated ${localTime(updatedAt, boardZone)}` : 'Not loaded yet'} ·{' '}
                {streaming ? 'live' : 'checking every 5 s'}
              </span>
              <button
                type="button"
                onClick={() => setTheme(dark ? 'light' : 'dark')}
                className={`min-h-touch min-w-touch rounded-xl border-2 px-5 text-[22px] font-semibold ${dark ? 'border-ink-line bg-ink-raised' : 'border-paper-line bg-paper-card'}`}
              >
                {dark ? 'Light theme' : 'Dark theme'}
              </button>
            </>
          )}
        </header>
      )}

      {deadLink && (
        <div
          role="alert"
          data-testid="board-link-dead"
          className="flex flex-1 flex-col items-start justify-center gap-6 rounded-2xl border-8 border-warning-bright p-10"
        >
          <span
            className={`flex items-center gap-6 text-[96px] font-bold leading-none ${dark ? 'text-warning-text' : 'text-warning'}`}
          >
            <ShapeIcon shape="octagon" size={110} />
            {board.error instanceof ApiRequestError && board.error.code === 'board_link_revoked'
              ? 'Board link revoked'
              : 'Board link not known'}
          </span>
          <span className="text-[48px] font-semibold leading-tight">
            This screen no longer shows the hangar. Nothing here is current.
          </span>
          <span className="text-[40px] leading-tight">{errorMessage(board.error)}</span>
        </div>
      )}
      {unauthorised && (
        <div role="alert" className="rounded-xl border-4 border-caution-bright p-6 text-[32px]">
          The board needs a signed-in person or an enrolled kiosk tablet.{' '}
          <a className="font-bold underline" href={signInHref}>
            Sign in at the desk
          </a>
        </div>
      )}
      {loading && <p className="text-[32px]">Loading the board…</p>}
      {board.isError && !unauthorised && !deadLink && !board.data && (
        <p className="text-[28px]">{errorMessage(board.error)}</p>
      )}

      {board.data && !deadLink && (
        <section
          className={`grid min-h-0 flex-1 grid-cols-2 auto-rows-fr gap-4 lg:grid-cols-4 ${stale ? 'opacity-80' : ''}`}
          aria-label="Airframes"
        >
          {board.data.map((airframe) => (
            <BoardTile key={airframe.id} airframe={airframe} theme={theme} now={now} />
          ))}
        </section>
      )}
      {!loading && (
        <footer className={dark ? '' : 'text-paper-muted'}>
          <LimitsNotice tone={dark ? 'dark' : 'light'} />
        </footer>
      )}
    </div>
  );
}
