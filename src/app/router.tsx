import { useTranslation } from 'react-i18next';
import { lazy, type ComponentType } from 'react';
import { ErrorBoundary } from 'react-error-boundary';
import { Navigate, Route, Routes, useLocation } from 'react-router-dom';
import { sharedWordsLoaded } from '@/i18n/i18n';
import { KioskLink } from '@/components/ui/kiosk-link';
import { KioskLayout } from './routes/kiosk-layout';
import { kioskWork } from './routes/kiosk-work';
import { KioskSignInRoute } from './routes/kiosk-sign-in-route';
import { StartRoute } from './routes/start-route';
import { RouteError } from './route-error';
import { AppFrame } from './update-offer';

// Declarative routes (Routes and Route) rather than a data router: the app loads no route data through the router,
// and the data router was 13 KB more script (brotli) on every first screen.
//
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

/**
 * A screen loaded on first visit. It waits for the shared words as well as its code (src/i18n/i18n.ts,
 * sharedWordsLoaded), so it never draws a key. While it loads, a navigation keeps the screen it left in view
 * (React Router moves in a transition), and a first visit shows nothing, as before any script.
 */
function screen<M>(load: () => Promise<M>, pick: (module: M) => ComponentType) {
  return lazy(() =>
    Promise.all([load(), sharedWordsLoaded()]).then(([module]) => ({ default: pick(module) })),
  );
}

const EnrolRoute = screen(
  () => import('./routes/enrol-route'),
  (m) => m.EnrolRoute,
);
const KioskAirframesRoute = screen(kioskWork, (m) => m.KioskAirframesRoute);
const KioskCheckRoute = screen(kioskWork, (m) => m.KioskCheckRoute);
const KioskResultRoute = screen(kioskWork, (m) => m.KioskResultRoute);
const KioskQueueRoute = screen(kioskWork, (m) => m.KioskQueueRoute);
const KioskHoldsRoute = screen(lead, (m) => m.KioskHoldsRoute);
const KioskHoldRoute = screen(lead, (m) => m.KioskHoldRoute);
const KioskDefectsRoute = screen(lead, (m) => m.KioskDefectsRoute);
const PilotListRoute = screen(acceptance, (m) => m.PilotListRoute);
const PilotAirframeRoute = screen(acceptance, (m) => m.PilotAirframeRoute);
const TagRoute = screen(
  () => import('./routes/tag-route'),
  (m) => m.TagRoute,
);
const BoardRoute = screen(
  () => import('./routes/board-route'),
  (m) => m.BoardRoute,
);
const DeskSignInRoute = screen(desk, (m) => m.DeskSignInRoute);
const DeskLayout = screen(deskLayout, (m) => m.DeskLayout);
const DeskHomeRoute = screen(desk, (m) => m.DeskHomeRoute);
const DeskDevicesRoute = screen(
  () => import('./routes/desk-devices-route'),
  (m) => m.DeskDevicesRoute,
);
const DeskHoldsRoute = screen(lead, (m) => m.DeskHoldsRoute);
const DeskHoldRoute = screen(lead, (m) => m.DeskHoldRoute);
const DeskDefectsRoute = screen(lead, (m) => m.DeskDefectsRoute);
const DeskHandoverRoute = screen(lead, (m) => m.DeskHandoverRoute);
const DeskMailRoute = screen(lead, (m) => m.DeskMailRoute);
const TypesPage = screen(types, (m) => m.TypesPage);
const TypePage = screen(types, (m) => m.TypePage);
const FleetPage = screen(fleet, (m) => m.FleetPage);
const TagSheetPage = screen(fleet, (m) => m.TagSheetPage);
const ToolsPage = screen(tools, (m) => m.ToolsPage);
const ToolTagSheetPage = screen(tools, (m) => m.ToolTagSheetPage);
const StaffPage = screen(staff, (m) => m.StaffPage);
const BadgeCardsPage = screen(staff, (m) => m.BadgeCardsPage);
const RecordsPage = screen(records, (m) => m.RecordsPage);
const RecordPage = screen(records, (m) => m.RecordPage);
const TrendsPage = screen(records, (m) => m.TrendsPage);
const AuditPage = screen(records, (m) => m.AuditPage);

/** Earlier addresses of the devices page, which was three pages before. */
const earlierDevicesPaths = ['kiosks', 'board-links', 'tablets'];

/**
 * Every address of the app. A screen that breaks (or whose code cannot be fetched) shows RouteError in its place;
 * moving to another address tries again.
 */
export function AppRoutes() {
  const { pathname } = useLocation();
  return (
    <ErrorBoundary FallbackComponent={RouteError} resetKeys={[pathname]}>
      <Routes>
        <Route element={<AppFrame />}>
          <Route path="/" element={<StartRoute />} />
          <Route path="/enrol/:code" element={<EnrolRoute />} />
          <Route path="/kiosk" element={<KioskSignInRoute />} />
          <Route path="/kiosk" element={<KioskLayout />}>
            <Route path="airframes" element={<KioskAirframesRoute />} />
            <Route path="airframes/:id" element={<KioskAirframesRoute />} />
            <Route path="airframes/:id/check/:kind" element={<KioskCheckRoute />} />
            <Route path="checks/:checkId" element={<KioskResultRoute />} />
            <Route path="queue" element={<KioskQueueRoute />} />
            <Route path="holds" element={<KioskHoldsRoute />} />
            <Route path="holds/:holdId" element={<KioskHoldRoute />} />
            <Route path="defects" element={<KioskDefectsRoute />} />
            <Route path="defects/:airframeId" element={<KioskDefectsRoute />} />
          </Route>
          {/* Pilots sign in on a kiosk too: the same layout (sign-in required, idle lock), under /pilot. */}
          <Route element={<KioskLayout />}>
            <Route path="/pilot" element={<PilotListRoute />} />
            <Route path="/pilot/airframes/:id" element={<PilotAirframeRoute />} />
          </Route>
          <Route path="/t/:token" element={<TagRoute />} />
          <Route path="/board" element={<BoardRoute />} />
          <Route path="/desk" element={<DeskSignInRoute />} />
          <Route path="/desk" element={<DeskLayout />}>
            <Route path="home" element={<DeskHomeRoute />} />
            <Route path="devices" element={<DeskDevicesRoute />} />
            {earlierDevicesPaths.map((path) => (
              <Route key={path} path={path} element={<Navigate to="/desk/devices" replace />} />
            ))}
            <Route path="holds" element={<DeskHoldsRoute />} />
            <Route path="holds/:holdId" element={<DeskHoldRoute />} />
            <Route path="defects" element={<DeskDefectsRoute />} />
            <Route path="defects/:airframeId" element={<DeskDefectsRoute />} />
            <Route path="handover" element={<DeskHandoverRoute />} />
            <Route path="mail" element={<DeskMailRoute />} />
            <Route path="types" element={<TypesPage />} />
            <Route path="types/:id" element={<TypePage />} />
            <Route path="fleet" element={<FleetPage />} />
            <Route path="tools" element={<ToolsPage />} />
            <Route path="staff" element={<StaffPage />} />
            <Route path="records" element={<RecordsPage />} />
            <Route path="records/:checkId" element={<RecordPage />} />
            <Route path="trends" element={<TrendsPage />} />
            <Route path="audit" element={<AuditPage />} />
          </Route>
          {/* Print sheets stand outside the desk layout: no desk header on paper. */}
          <Route path="/desk/tags/print" element={<TagSheetPage />} />
          <Route path="/desk/tools/print" element={<ToolTagSheetPage />} />
          <Route path="/desk/badges/print" element={<BadgeCardsPage />} />
          <Route path="*" element={<NoSuchPage />} />
        </Route>
      </Routes>
    </ErrorBoundary>
  );
}
