import type { JSX } from 'react';
import { TypePage, TypesPage } from './components/types-pages';
import { FleetPage, TagSheetPage } from './components/fleet-pages';
import { BadgeCardsPage, StaffPage } from './components/staff-pages';
import { AuditPage, RecordPage, RecordsPage, TrendsPage } from './components/records-pages';
import { TabletsPage } from './components/tablets-page';

export const EngineeringTypesPage = TypesPage;
export const EngineeringTypePage = TypePage;
export const EngineeringFleetPage = FleetPage;
export const EngineeringTagSheetPage = TagSheetPage;
export const EngineeringStaffPage = StaffPage;
export const EngineeringBadgeCardsPage = BadgeCardsPage;
export const EngineeringTabletsPage = TabletsPage;
export const EngineeringRecordsPage = RecordsPage;
export const EngineeringRecordPage = RecordPage;
export const EngineeringTrendsPage = TrendsPage;
export const EngineeringAuditPage = AuditPage;

/**
 * The desk pages of issue 6, for the router. Records and trends are also for shift leads; the rest need
 * engineering (the server answers 403 otherwise, and the pages show that message). The two print pages print
 * only their sheet, but read best mounted outside the desk layout.
 */
export const engineeringPages: { path: string; element: JSX.Element; title: string }[] = [
  { path: '/desk/types', element: <TypesPage />, title: 'Types and check cards' },
  { path: '/desk/types/:id', element: <TypePage />, title: 'Type and limits versions' },
  { path: '/desk/fleet', element: <FleetPage />, title: 'Airframes and tags' },
  { path: '/desk/tags/print', element: <TagSheetPage />, title: 'Tag sheet' },
  { path: '/desk/staff', element: <StaffPage />, title: 'Staff and badges' },
  { path: '/desk/badges/print', element: <BadgeCardsPage />, title: 'Badge cards' },
  { path: '/desk/tablets', element: <TabletsPage />, title: 'Kiosk tablets and board links' },
  { path: '/desk/records', element: <RecordsPage />, title: 'Records' },
  { path: '/desk/records/:checkId', element: <RecordPage />, title: 'Check record' },
  { path: '/desk/trends', element: <TrendsPage />, title: 'Fluid trends' },
  { path: '/desk/audit', element: <AuditPage />, title: 'Audit trail' },
];
