import { useTranslation } from 'react-i18next';
import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { sharedWordsLoaded } from '@/i18n/i18n';
import { KioskLink } from '@/components/ui/kiosk-link';
import { KioskLayout } from './routes/kiosk-layout';
import { kioskWork } from './routes/kiosk-work';
import { KioskSignInRoute } from './routes/kiosk-sign-in-route';
import { StartRoute } from './routes/start-route';
import { RouteError } from './route-error';
import { AppFrame } from './update-offer';

// The first screens of the start page and the kiosk load with the app; the rest of the kiosk right after; the
// board, the enrolment and tag pages, the pilot, lead and engineering desks load on first visit, so a tablet's first
// screen does not carry the desk, the forms, the charts or the print sheets. The service worker keeps every chunk.
const lead = () => import('./routes/lead-routes');
const acceptance = () => import('./routes/acceptance-routes');
const desk = () => import('./routes/desk-routes');
const deskLayout = () => import('./routes/desk-layout');
const types = () => import('@/features/engineering-types/components/types-pages');
const fleet = () => import('@/features/fleet/components/fleet-pages');
const tools = () => import('@/features/tools/components/tools-pages');
const staff = () => import('@/features/staff/components/staff-pages');
const records = () => import('@/features/records/components/records-pages');

function NoSuchPage() {
  const { t } = useTranslation('app');
  return (
    <div className="flex min-h-dvh flex-col items-start gap-5 bg-ink p-8 text-paper">
      <h1 className="text-[40px] font-bold">{t('noSuchPage.title')}</h1>
      <KioskLink to="/">{t('backToStart')}</KioskLink>
    </div>
  );
}

/** Each lazily loaded route waits for the shared words as well as its code (src/i18n/i18n.ts, sharedWordsLoaded). */
function withSharedWords(routes: RouteObject[]): RouteObject[] {
  return routes.map((route) => {
    const { lazy, children } = route;
    return {
      ...route,
      ...(typeof lazy === 'function'
        ? { lazy: () => Promise.all([lazy(), sharedWordsLoaded()]).then(([loaded]) => loaded) }
        : {}),
      ...(children ? { children: withSharedWords(children) } : {}),
    } as RouteObject;
  });
}

export const router = createBrowserRouter(
  withSharedWords([
    {
      element: <AppFrame />,
      errorElement: <RouteError />,
      children: [
        { path: '/', element: <StartRoute /> },
        {
          path: '/enrol/:code',
          lazy: () => import('./routes/enrol-route').then((m) => ({ Component: m.EnrolRoute })),
        },
        { path: '/kiosk', element: <KioskSignInRoute /> },
        {
          path: '/kiosk',
          element: <KioskLayout />,
          children: [
            {
              path: 'airframes',
              lazy: () => kioskWork().then((m) => ({ Component: m.KioskAirframesRoute })),
            },
            {
              path: 'airframes/:id',
              lazy: () => kioskWork().then((m) => ({ Component: m.KioskAirframesRoute })),
            },
            {
              path: 'airframes/:id/check/:kind',
              lazy: () => kioskWork().then((m) => ({ Component: m.KioskCheckRoute })),
            },
            {
              path: 'checks/:checkId',
              lazy: () => kioskWork().then((m) => ({ Component: m.KioskResultRoute })),
            },
            { path: 'queue', lazy: () => kioskWork().then((m) => ({ Component: m.KioskQueueRoute })) },
            { path: 'holds', lazy: () => lead().then((m) => ({ Component: m.KioskHoldsRoute })) },
            { path: 'holds/:holdId', lazy: () => lead().then((m) => ({ Component: m.KioskHoldRoute })) },
            { path: 'defects', lazy: () => lead().then((m) => ({ Component: m.KioskDefectsRoute })) },
            {
              path: 'defects/:airframeId',
              lazy: () => lead().then((m) => ({ Component: m.KioskDefectsRoute })),
            },
          ],
        },
        // Pilots sign in on a kiosk too: the same layout (sign-in required, idle lock), under /pilot.
        {
          element: <KioskLayout />,
          children: [
            { path: '/pilot', lazy: () => acceptance().then((m) => ({ Component: m.PilotListRoute })) },
            {
              path: '/pilot/airframes/:id',
              lazy: () => acceptance().then((m) => ({ Component: m.PilotAirframeRoute })),
            },
          ],
        },
        {
          path: '/t/:token',
          lazy: () => import('./routes/tag-route').then((m) => ({ Component: m.TagRoute })),
        },
        {
          path: '/board',
          lazy: () => import('./routes/board-route').then((m) => ({ Component: m.BoardRoute })),
        },
        { path: '/desk', lazy: () => desk().then((m) => ({ Component: m.DeskSignInRoute })) },
        {
          path: '/desk',
          lazy: () => deskLayout().then((m) => ({ Component: m.DeskLayout })),
          children: [
            { path: 'home', lazy: () => desk().then((m) => ({ Component: m.DeskHomeRoute })) },
            {
              path: 'devices',
              lazy: () =>
                import('./routes/desk-devices-route').then((m) => ({ Component: m.DeskDevicesRoute })),
            },
            // Earlier addresses of the devices page, which was three pages before.
            ...['kiosks', 'board-links', 'tablets'].map((path) => ({
              path,
              element: <Navigate to="/desk/devices" replace />,
            })),
            { path: 'holds', lazy: () => lead().then((m) => ({ Component: m.DeskHoldsRoute })) },
            { path: 'holds/:holdId', lazy: () => lead().then((m) => ({ Component: m.DeskHoldRoute })) },
            { path: 'defects', lazy: () => lead().then((m) => ({ Component: m.DeskDefectsRoute })) },
            {
              path: 'defects/:airframeId',
              lazy: () => lead().then((m) => ({ Component: m.DeskDefectsRoute })),
            },
            { path: 'handover', lazy: () => lead().then((m) => ({ Component: m.DeskHandoverRoute })) },
            { path: 'mail', lazy: () => lead().then((m) => ({ Component: m.DeskMailRoute })) },
            { path: 'types', lazy: () => types().then((m) => ({ Component: m.TypesPage })) },
            {
              path: 'types/:id',
              lazy: () => types().then((m) => ({ Component: m.TypePage })),
            },
            { path: 'fleet', lazy: () => fleet().then((m) => ({ Component: m.FleetPage })) },
            { path: 'tools', lazy: () => tools().then((m) => ({ Component: m.ToolsPage })) },
            { path: 'staff', lazy: () => staff().then((m) => ({ Component: m.StaffPage })) },
            {
              path: 'records',
              lazy: () => records().then((m) => ({ Component: m.RecordsPage })),
            },
            {
              path: 'records/:checkId',
              lazy: () => records().then((m) => ({ Component: m.RecordPage })),
            },
            { path: 'trends', lazy: () => records().then((m) => ({ Component: m.TrendsPage })) },
            { path: 'audit', lazy: () => records().then((m) => ({ Component: m.AuditPage })) },
          ],
        },
        // Print sheets stand outside the desk layout: no desk header on paper.
        {
          path: '/desk/tags/print',
          lazy: () => fleet().then((m) => ({ Component: m.TagSheetPage })),
        },
        {
          path: '/desk/tools/print',
          lazy: () => tools().then((m) => ({ Component: m.ToolTagSheetPage })),
        },
        {
          path: '/desk/badges/print',
          lazy: () => staff().then((m) => ({ Component: m.BadgeCardsPage })),
        },
        {
          path: '*',
          element: <NoSuchPage />,
        },
      ],
    },
  ]),
);
