import { createBrowserRouter, Link } from 'react-router-dom';
import { BoardRoute } from './routes/board-route';
import { DeskLayout } from './routes/desk-layout';
import { DeskHomeRoute, DeskKiosksRoute, DeskSignInRoute } from './routes/desk-routes';
import { EnrolRoute } from './routes/enrol-route';
import { KioskAirframesRoute } from './routes/kiosk-airframes-route';
import { KioskCheckRoute } from './routes/kiosk-check-route';
import { KioskLayout } from './routes/kiosk-layout';
import { KioskQueueRoute } from './routes/kiosk-queue-route';
import { KioskResultRoute } from './routes/kiosk-result-route';
import { KioskSignInRoute } from './routes/kiosk-sign-in-route';
import {
  DeskBoardLinksRoute,
  DeskHandoverRoute,
  DeskHoldRoute,
  DeskHoldsRoute,
  DeskMailRoute,
  KioskHoldRoute,
  KioskHoldsRoute,
} from './routes/lead-routes';
import { PilotAirframeRoute, PilotListRoute } from './routes/pilot-routes';
import { StartRoute } from './routes/start-route';
import { TagRoute } from './routes/tag-route';
import { RouteError } from './route-error';
import { engineeringPages } from '../features/engineering/pages';

// Print sheets stand alone (no desk header on paper); the other engineering pages sit in the desk layout.
const isPrintSheet = (path: string) => path.endsWith('/print');

export const router = createBrowserRouter([
  {
    errorElement: <RouteError />,
    children: [
      { path: '/', element: <StartRoute /> },
      { path: '/enrol/:code', element: <EnrolRoute /> },
      { path: '/kiosk', element: <KioskSignInRoute /> },
      {
        path: '/kiosk',
        element: <KioskLayout />,
        children: [
          { path: 'airframes', element: <KioskAirframesRoute /> },
          { path: 'airframes/:id', element: <KioskAirframesRoute /> },
          { path: 'airframes/:id/check/:kind', element: <KioskCheckRoute /> },
          { path: 'checks/:checkId', element: <KioskResultRoute /> },
          { path: 'queue', element: <KioskQueueRoute /> },
          { path: 'holds', element: <KioskHoldsRoute /> },
          { path: 'holds/:holdId', element: <KioskHoldRoute /> },
        ],
      },
      // Pilots sign in on a kiosk too: the same layout (sign-in required, idle lock), under /pilot.
      {
        element: <KioskLayout />,
        children: [
          { path: '/pilot', element: <PilotListRoute /> },
          { path: '/pilot/airframes/:id', element: <PilotAirframeRoute /> },
        ],
      },
      { path: '/t/:token', element: <TagRoute /> },
      { path: '/board', element: <BoardRoute /> },
      { path: '/desk', element: <DeskSignInRoute /> },
      {
        path: '/desk',
        element: <DeskLayout />,
        children: [
          { path: 'home', element: <DeskHomeRoute /> },
          { path: 'kiosks', element: <DeskKiosksRoute /> },
          { path: 'holds', element: <DeskHoldsRoute /> },
          { path: 'holds/:holdId', element: <DeskHoldRoute /> },
          { path: 'handover', element: <DeskHandoverRoute /> },
          { path: 'board-links', element: <DeskBoardLinksRoute /> },
          { path: 'mail', element: <DeskMailRoute /> },
          ...engineeringPages
            .filter((page) => !isPrintSheet(page.path))
            .map((page) => ({ path: page.path.replace('/desk/', ''), element: page.element })),
        ],
      },
      ...engineeringPages.filter((page) => isPrintSheet(page.path)).map((page) => ({ path: page.path, element: page.element })),
      {
        path: '*',
        element: (
          <div className="flex min-h-dvh flex-col items-start gap-5 bg-ink p-8 text-paper">
            <h1 className="text-[40px] font-bold">No such page</h1>
            <Link
              to="/"
              className="inline-flex min-h-touch items-center rounded-xl border-2 border-ink-line bg-ink-raised px-6 text-[24px] font-semibold"
            >
              Back to start
            </Link>
          </div>
        ),
      },
    ],
  },
]);
