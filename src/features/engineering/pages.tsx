import { TypePage, TypesPage } from './components/types-pages';
import { FleetPage, TagSheetPage } from './components/fleet-pages';
import { BadgeCardsPage, StaffPage } from './components/staff-pages';
import { AuditPage, RecordPage, RecordsPage, TrendsPage } from './components/records-pages';

export const EngineeringTypesPage = TypesPage;
export const EngineeringTypePage = TypePage;
export const EngineeringFleetPage = FleetPage;
export const EngineeringTagSheetPage = TagSheetPage;
export const EngineeringStaffPage = StaffPage;
export const EngineeringBadgeCardsPage = BadgeCardsPage;
export const EngineeringRecordsPage = RecordsPage;
export const EngineeringRecordPage = RecordPage;
export const EngineeringTrendsPage = TrendsPage;
export const EngineeringAuditPage = AuditPage;
