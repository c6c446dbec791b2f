// Every process that reads these records also writes words about them (a state's reasons, a finding's words):
// set up the process's i18next, in English, before any of them runs, whether the entry is the server, a seed, a
// bench or a test's global set-up.
import '@server/i18n/translator';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

type Attrs<M extends Model> = InferAttributes<M>;
type Create<M extends Model> = InferCreationAttributes<M>;

export class Base extends Model<Attrs<Base>, Create<Base>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  /** IANA zone of the base's clock, e.g. "Atlantic/Madeira": the kiosk and board show times in it. */
  declare timeZone: CreationOptional<string>;
}

export class AircraftType extends Model<Attrs<AircraftType>, Create<AircraftType>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
}

export class Staff extends Model<Attrs<Staff>, Create<Staff>> {
  declare id: CreationOptional<number>;
  declare badgeNumber: string;
  declare name: string;
  declare licenceNumber: string | null;
  /** Comma-separated roles. */
  declare roles: string;
  declare pinHash: string;
  declare passwordHash: string | null;
  declare failedAttempts: CreationOptional<number>;
  declare lockedUntil: Date | null;
  declare mustChangePin: CreationOptional<boolean>;
  declare active: CreationOptional<boolean>;
  /** The language the kiosk switches to at this badge's sign-in; null keeps the tablet's (migration 0013). */
  declare preferredLanguage: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

export class LimitsVersion extends Model<Attrs<LimitsVersion>, Create<LimitsVersion>> {
  declare id: CreationOptional<number>;
  declare typeId: number;
  declare version: number;
  declare status: 'draft' | 'published';
  /** JSON of an AircraftTypeDefinition. */
  declare definition: string;
  declare publishedAt: Date | null;
  declare publishedBy: number | null;
  declare createdAt: CreationOptional<Date>;
}

export class Airframe extends Model<Attrs<Airframe>, Create<Airframe>> {
  declare id: CreationOptional<number>;
  declare fleetNumber: string;
  declare serial: string;
  declare typeId: number;
  declare baseId: number;
  /** DECIMAL comes back from the driver as a string. */
  declare hours: CreationOptional<string | number>;
  /** Flights flown; like hours, it only moves forward. */
  declare flights: CreationOptional<number>;
  /** Landings made; added up from each recorded flight. */
  declare landings: CreationOptional<number>;
  /** The registration mark, e.g. "QX-TNA"; unique among airframes in service (migration 0009). */
  declare registration: CreationOptional<string | null>;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
}

export class Tag extends Model<Attrs<Tag>, Create<Tag>> {
  declare id: CreationOptional<number>;
  declare airframeId: number;
  declare token: string;
  declare issuedAt: Date;
  declare revokedAt: Date | null;
}

export class KioskDevice extends Model<Attrs<KioskDevice>, Create<KioskDevice>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare tokenHash: string | null;
  declare enrolCodeHash: string | null;
  declare enrolExpiresAt: Date | null;
  declare enrolledAt: Date | null;
  declare revokedAt: Date | null;
  declare lastSeenAt: Date | null;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
  /** The base the tablet stands at (migration 0016): its airframe list shows that base first. */
  declare baseId: CreationOptional<number | null>;
}

export class Check extends Model<Attrs<Check>, Create<Check>> {
  declare id: string;
  declare airframeId: number;
  declare kind: 'pre_flight' | 'ground_run' | 'after_flight' | 'servicing';
  declare limitsVersionId: number;
  declare context: string;
  declare verdict: 'in_limits' | 'service' | 'out_of_limits';
  declare note: string | null;
  declare airframeHours: string | number | null;
  /** The airframe's flights when the check was signed (null before they were stamped). */
  declare airframeFlights: CreationOptional<number | null>;
  declare signedBy: number;
  declare signedAt: Date;
  declare contentHash: string;
  /** Canonical JSON of exactly what was signed; its SHA-256 is contentHash. */
  declare signedContent: string | null;
  declare submissionHash: string;
  declare correctsCheckId: string | null;
  declare kioskDeviceId: number | null;
  declare createdAt: CreationOptional<Date>;
}

export class Reading extends Model<Attrs<Reading>, Create<Reading>> {
  declare id: CreationOptional<number>;
  declare checkId: string;
  declare seq: number;
  declare checkpointCode: string;
  declare entry: string;
  declare value: number | null;
  declare unit: string | null;
  declare verdict: 'in_limits' | 'service' | 'out_of_limits';
  declare bandId: string;
  declare message: string;
  declare action: string;
  declare expected: number | null;
  /** The register's tool the reading was taken with, and (JSON) the tool as it stood at signing. */
  declare toolId: CreationOptional<number | null>;
  declare tool: CreationOptional<string | null>;
}

/** A gauge, nitrogen charging kit or servicing cart of the tools register. */
export class Tool extends Model<Attrs<Tool>, Create<Tool>> {
  declare id: CreationOptional<number>;
  declare number: string;
  declare kind: 'pressure_gauge' | 'nitrogen_charging_kit' | 'servicing_cart';
  declare description: string;
  declare serial: string;
  /** "YYYY-MM-DD". */
  declare calibrationDue: string;
  declare retiredAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export class Hold extends Model<Attrs<Hold>, Create<Hold>> {
  declare id: CreationOptional<number>;
  declare airframeId: number;
  declare checkId: string;
  declare reason: string;
  declare openedAt: Date;
  declare releasedAt: Date | null;
  declare releasedBy: number | null;
}

export class AuditEvent extends Model<Attrs<AuditEvent>, Create<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare at: Date;
  declare actorId: number | null;
  declare action: string;
  declare entity: string;
  declare entityId: string;
  declare payload: string;
  declare prevHash: string;
  declare hash: string;
}

/** A recorded set of flight hours, flights and landings (table airframe_usage). */
export class UsageEntry extends Model<Attrs<UsageEntry>, Create<UsageEntry>> {
  declare id: CreationOptional<number>;
  declare airframeId: number;
  declare source: 'after_flight_check' | 'flight_close';
  declare checkId: string | null;
  declare hours: string | number;
  declare flights: number;
  declare landings: number;
  declare hoursFlown: string | number;
  declare flightsFlown: number;
  declare landingsMade: number;
  declare recordedBy: number;
  declare recordedAt: Date;
  declare signedWith: 'pin' | 'password' | null;
  declare contentHash: string | null;
  declare signedContent: string | null;
}

export class Session extends Model<Attrs<Session>, Create<Session>> {
  declare sid: string;
  declare expires: Date | null;
  declare data: string | null;
}

// Column types the tables repeat, named once.
const ref = DataTypes.INTEGER.UNSIGNED;
const instant = DataTypes.DATE(3);
const sha256Hex = DataTypes.CHAR(64);
const uuid = DataTypes.CHAR(36);
const longText = DataTypes.TEXT('long');
const checkKind = DataTypes.ENUM('pre_flight', 'ground_run', 'after_flight', 'servicing');
const verdict = DataTypes.ENUM('in_limits', 'service', 'out_of_limits');
const id = { type: ref, autoIncrement: true, primaryKey: true };
const bigId = { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true };
const uuidKey = { type: uuid, primaryKey: true };
const createdAt = { type: instant, allowNull: false, defaultValue: DataTypes.NOW };
/** Who signed, when, how, and exactly what: every signed record carries these five columns. */
const signature = {
  signedBy: ref,
  signedAt: instant,
  signedWith: DataTypes.ENUM('pin', 'password'),
  contentHash: sha256Hex,
  signedContent: longText,
};
const tableOptions = (sequelize: Sequelize, tableName: string) => ({
  sequelize,
  tableName,
  underscored: true,
  timestamps: false,
});

/** Binds every model to the connection; call once per Sequelize instance before any query. */
export function initModels(sequelize: Sequelize) {
  initFleetModels(sequelize);
  initDeviceModels(sequelize);
  initCheckModels(sequelize);
  initCheckEvidenceModels(sequelize);
  initSignOffModels(sequelize);
  initAirworthinessModels(sequelize);
  initUsageModels(sequelize);
  initToolModels(sequelize);
  Session.init(
    { sid: { type: DataTypes.STRING(64), primaryKey: true }, expires: DataTypes.DATE, data: DataTypes.TEXT },
    tableOptions(sequelize, 'sessions'),
  );
}

/** The flight hours, flights and landings recorded for the airframes. */
function initUsageModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  UsageEntry.init(
    {
      id,
      airframeId: ref,
      source: DataTypes.ENUM('after_flight_check', 'flight_close'),
      checkId: uuid,
      hours: DataTypes.DECIMAL(10, 1),
      flights: ref,
      landings: ref,
      hoursFlown: DataTypes.DECIMAL(10, 1),
      flightsFlown: ref,
      landingsMade: ref,
      recordedBy: ref,
      recordedAt: instant,
      signedWith: DataTypes.ENUM('pin', 'password'),
      contentHash: sha256Hex,
      signedContent: longText,
    },
    opts('airframe_usage'),
  );
}

/** The tools register: the instruments readings and top-ups are taken with. */
function initToolModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  Tool.init(
    {
      id,
      number: DataTypes.STRING,
      kind: DataTypes.ENUM('pressure_gauge', 'nitrogen_charging_kit', 'servicing_cart'),
      description: DataTypes.STRING,
      serial: DataTypes.STRING,
      calibrationDue: DataTypes.DATEONLY,
      retiredAt: instant,
      createdAt,
    },
    opts('tools'),
  );
}

/** The fleet's bases, types, limits, people and devices. */
function initFleetModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  Base.init(
    {
      id,
      code: DataTypes.STRING,
      name: DataTypes.STRING,
      timeZone: { type: DataTypes.STRING, defaultValue: 'UTC' },
    },
    opts('bases'),
  );
  AircraftType.init(
    { id, code: DataTypes.STRING, name: DataTypes.STRING, createdAt },
    opts('aircraft_types'),
  );
  Staff.init(
    {
      id,
      badgeNumber: DataTypes.STRING,
      name: DataTypes.STRING,
      licenceNumber: DataTypes.STRING,
      roles: DataTypes.STRING,
      pinHash: DataTypes.STRING,
      passwordHash: DataTypes.STRING,
      failedAttempts: { type: DataTypes.INTEGER, defaultValue: 0 },
      lockedUntil: instant,
      mustChangePin: { type: DataTypes.BOOLEAN, defaultValue: false },
      active: { type: DataTypes.BOOLEAN, defaultValue: true },
      preferredLanguage: { type: DataTypes.STRING, defaultValue: null },
      createdAt,
    },
    opts('staff'),
  );
  LimitsVersion.init(
    {
      id,
      typeId: ref,
      version: DataTypes.INTEGER,
      status: DataTypes.ENUM('draft', 'published'),
      definition: longText,
      publishedAt: instant,
      publishedBy: ref,
      createdAt,
    },
    opts('limits_versions'),
  );
  Airframe.init(
    {
      id,
      fleetNumber: DataTypes.STRING,
      serial: DataTypes.STRING,
      typeId: ref,
      baseId: ref,
      hours: { type: DataTypes.DECIMAL(10, 1), defaultValue: 0 },
      flights: { type: ref, defaultValue: 0 },
      landings: { type: ref, defaultValue: 0 },
      registration: { type: DataTypes.STRING(16), allowNull: true },
      active: { type: DataTypes.BOOLEAN, defaultValue: true },
      createdAt,
    },
    opts('airframes'),
  );
}

/** The airframes' QR tags and the enrolled kiosk tablets. */
function initDeviceModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  Tag.init(
    {
      id,
      airframeId: ref,
      token: DataTypes.STRING,
      issuedAt: instant,
      revokedAt: instant,
    },
    opts('tags'),
  );
  KioskDevice.init(
    {
      id,
      name: DataTypes.STRING,
      tokenHash: sha256Hex,
      enrolCodeHash: sha256Hex,
      enrolExpiresAt: instant,
      enrolledAt: instant,
      revokedAt: instant,
      lastSeenAt: instant,
      createdBy: ref,
      createdAt,
      baseId: ref,
    },
    opts('kiosk_devices'),
  );
  // Devices shown a board: which bases a board link shows (migration 0016).
  BoardLinkBase.init(
    { boardLinkId: { type: ref, primaryKey: true }, baseId: { type: ref, primaryKey: true } },
    opts('board_link_bases'),
  );
}

/** Signed checks, their readings, the holds they open and the audit trail. */
function initCheckModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  Check.init(
    {
      id: uuidKey,
      airframeId: ref,
      kind: checkKind,
      limitsVersionId: ref,
      context: DataTypes.TEXT,
      verdict: verdict,
      note: DataTypes.TEXT,
      airframeHours: DataTypes.DECIMAL(10, 1),
      airframeFlights: ref,
      signedBy: ref,
      signedAt: instant,
      contentHash: sha256Hex,
      signedContent: longText,
      submissionHash: sha256Hex,
      correctsCheckId: uuid,
      kioskDeviceId: ref,
      createdAt,
    },
    opts('checks'),
  );
  Reading.init(
    {
      id: bigId,
      checkId: uuid,
      seq: DataTypes.INTEGER,
      checkpointCode: DataTypes.STRING,
      entry: DataTypes.TEXT,
      value: DataTypes.DOUBLE,
      unit: DataTypes.STRING,
      verdict: verdict,
      bandId: DataTypes.STRING,
      message: DataTypes.TEXT,
      action: DataTypes.TEXT,
      expected: DataTypes.DOUBLE,
      toolId: ref,
      tool: DataTypes.TEXT,
    },
    opts('readings'),
  );
  Hold.init(
    {
      id,
      airframeId: ref,
      checkId: uuid,
      reason: DataTypes.TEXT,
      openedAt: instant,
      releasedAt: instant,
      releasedBy: ref,
    },
    opts('holds'),
  );
  AuditEvent.init(
    {
      id: bigId,
      at: instant,
      actorId: ref,
      action: DataTypes.STRING,
      entity: DataTypes.STRING,
      entityId: DataTypes.STRING,
      payload: longText,
      prevHash: sha256Hex,
      hash: sha256Hex,
    },
    opts('audit_events'),
  );
}

export class ServicingEntry extends Model<Attrs<ServicingEntry>, Create<ServicingEntry>> {
  declare id: CreationOptional<number>;
  declare checkId: string;
  declare airframeId: number;
  declare checkpointCode: string;
  declare system: string | null;
  declare quantityL: number;
  declare enteredValue: number;
  declare enteredUnit: string;
  declare fluidSpec: string;
  declare batch: string;
  /** "YYYY-MM-DD"; null on top-ups stored before it was asked. */
  declare canOpenedOn: CreationOptional<string | null>;
  /** JSON of the level reading entry before the top-up. */
  declare levelBefore: string;
  declare toolId: CreationOptional<number | null>;
  /** JSON of the tool as it stood at signing. */
  declare tool: CreationOptional<string | null>;
  declare addedAt: Date;
}

export class Photo extends Model<Attrs<Photo>, Create<Photo>> {
  declare id: string;
  declare checkId: string | null;
  declare checkpointCode: string | null;
  declare storedName: string;
  declare mimeType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare uploadedBy: number;
  declare uploadedAt: Date;
}

export class CheckDraft extends Model<Attrs<CheckDraft>, Create<CheckDraft>> {
  declare id: string;
  declare airframeId: number;
  declare kind: 'pre_flight' | 'ground_run' | 'after_flight' | 'servicing';
  declare startedBy: number;
  declare startedAt: Date;
  declare touchedAt: Date;
  declare closedAt: CreationOptional<Date | null>;
  declare closedBy: CreationOptional<number | null>;
  declare closeReason: CreationOptional<string | null>;
}

/** What a check carries besides its readings: fluid added, photos, and the drafts tablets announce. */
function initCheckEvidenceModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  ServicingEntry.init(
    {
      id: id,
      checkId: uuid,
      airframeId: ref,
      checkpointCode: DataTypes.STRING,
      system: DataTypes.STRING,
      quantityL: DataTypes.DOUBLE,
      enteredValue: DataTypes.DOUBLE,
      enteredUnit: DataTypes.STRING,
      fluidSpec: DataTypes.STRING,
      batch: DataTypes.STRING,
      canOpenedOn: DataTypes.DATEONLY,
      levelBefore: DataTypes.TEXT,
      toolId: ref,
      tool: DataTypes.TEXT,
      addedAt: instant,
    },
    opts('servicing_entries'),
  );
  Photo.init(
    {
      id: uuidKey,
      checkId: uuid,
      checkpointCode: DataTypes.STRING,
      storedName: DataTypes.STRING,
      mimeType: DataTypes.STRING,
      sizeBytes: ref,
      sha256: sha256Hex,
      uploadedBy: ref,
      uploadedAt: instant,
    },
    opts('photos'),
  );
  CheckDraft.init(
    {
      id: uuidKey,
      airframeId: ref,
      kind: checkKind,
      startedBy: ref,
      startedAt: instant,
      touchedAt: instant,
      closedAt: instant,
      closedBy: ref,
      closeReason: DataTypes.TEXT,
    },
    opts('check_drafts'),
  );
}

export class HoldCorrectiveAction extends Model<Attrs<HoldCorrectiveAction>, Create<HoldCorrectiveAction>> {
  declare id: CreationOptional<number>;
  declare holdId: number;
  declare text: string;
  declare recordedBy: number;
  declare recordedAt: Date;
  declare independentInspection: CreationOptional<boolean>;
}

export class HoldCountersign extends Model<Attrs<HoldCountersign>, Create<HoldCountersign>> {
  declare id: CreationOptional<number>;
  declare holdId: number;
  declare decision: 'release' | 'keep';
  declare reason: string | null;
  declare recheckCheckId: string | null;
  declare signedBy: number;
  declare signedAt: Date;
  declare signedWith: 'pin' | 'password';
  declare contentHash: string;
  declare signedContent: string;
  /** JSON of the signer's authorisation at signing; null with `legacy` for releases from before they were kept. */
  declare authorisation: CreationOptional<string | null>;
  declare legacy: CreationOptional<boolean>;
  /** The id the screen gave this act of signing (migration 0017): a resend is answered as the first. */
  declare requestId: CreationOptional<string | null>;
}

export class Acceptance extends Model<Attrs<Acceptance>, Create<Acceptance>> {
  declare id: CreationOptional<number>;
  declare airframeId: number;
  declare acceptedBy: number;
  declare acceptedAt: Date;
  /** JSON array of the check ids the acceptance rested on. */
  declare checkIds: string;
  declare contentHash: string;
  declare signedContent: string;
  /** The id the screen gave this act of signing (migration 0017): a resend is answered as the first. */
  declare requestId: CreationOptional<string | null>;
}

export class BoardLink extends Model<Attrs<BoardLink>, Create<BoardLink>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare tokenHash: string;
  declare createdBy: number;
  declare createdAt: CreationOptional<Date>;
  declare revokedAt: Date | null;
  declare revokedBy: number | null;
  declare lastSeenAt: Date | null;
}

/** The bases a board link shows (migration 0016); a link with none shows every base. */
export class BoardLinkBase extends Model<Attrs<BoardLinkBase>, Create<BoardLinkBase>> {
  declare boardLinkId: number;
  declare baseId: number;
}

export class MailDelivery extends Model<Attrs<MailDelivery>, Create<MailDelivery>> {
  declare id: CreationOptional<number>;
  declare topic: string;
  declare topicKey: string | null;
  /** Comma-separated addresses. */
  declare recipients: string;
  declare subject: string;
  declare text: string;
  declare status: 'pending' | 'sent' | 'failed';
  declare error: string | null;
  declare createdAt: CreationOptional<Date>;
  declare sentAt: Date | null;
  declare attempts: CreationOptional<number>;
  declare lastAttemptAt: Date | null;
}

export class CaughtMail extends Model<Attrs<CaughtMail>, Create<CaughtMail>> {
  declare id: CreationOptional<number>;
  declare recipients: string;
  declare sender: string | null;
  declare subject: string;
  declare text: string;
  declare receivedAt: Date;
}

/** Holds' sign-off, pilots' acceptances, board links, and (through initMailModels) mail. */
function initSignOffModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  HoldCorrectiveAction.init(
    {
      id,
      holdId: ref,
      text: DataTypes.TEXT,
      recordedBy: ref,
      recordedAt: instant,
      independentInspection: { type: DataTypes.BOOLEAN, defaultValue: false },
    },
    opts('hold_corrective_actions'),
  );
  HoldCountersign.init(
    {
      id,
      holdId: ref,
      decision: DataTypes.ENUM('release', 'keep'),
      reason: DataTypes.TEXT,
      recheckCheckId: uuid,
      ...signature,
      authorisation: DataTypes.TEXT,
      legacy: { type: DataTypes.BOOLEAN, defaultValue: false },
      requestId: uuid,
    },
    opts('hold_countersigns'),
  );
  Acceptance.init(
    {
      id,
      airframeId: ref,
      acceptedBy: ref,
      acceptedAt: instant,
      checkIds: DataTypes.TEXT,
      contentHash: sha256Hex,
      signedContent: longText,
      requestId: uuid,
    },
    opts('acceptances'),
  );
  BoardLink.init(
    {
      id,
      name: DataTypes.STRING,
      tokenHash: sha256Hex,
      createdBy: ref,
      createdAt,
      revokedAt: instant,
      revokedBy: ref,
      lastSeenAt: instant,
    },
    opts('board_links'),
  );
  initMailModels(sequelize);
}

/** Mail sent and tried, and the local fake's catch. */
function initMailModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  MailDelivery.init(
    {
      id,
      topic: DataTypes.STRING,
      topicKey: DataTypes.STRING,
      recipients: DataTypes.TEXT,
      subject: DataTypes.STRING,
      text: longText,
      status: DataTypes.ENUM('pending', 'sent', 'failed'),
      error: DataTypes.TEXT,
      createdAt,
      sentAt: instant,
      attempts: { type: ref, defaultValue: 1 },
      lastAttemptAt: instant,
    },
    opts('mail_deliveries'),
  );
  CaughtMail.init(
    {
      id,
      recipients: DataTypes.TEXT,
      sender: DataTypes.STRING,
      subject: DataTypes.STRING,
      text: longText,
      receivedAt: instant,
    },
    opts('caught_mail'),
  );
}

export class StaffAuthorisation extends Model<Attrs<StaffAuthorisation>, Create<StaffAuthorisation>> {
  declare id: CreationOptional<number>;
  declare staffId: number;
  declare category: 'A' | 'B1' | 'B2' | 'B3' | 'C';
  /** JSON array of type codes. */
  declare typeCodes: string;
  /** JSON array of ATA chapters, or ["all"]. */
  declare scope: string;
  /** "YYYY-MM-DD": valid through that day (UTC). */
  declare expiresOn: string;
  declare reference: string;
  declare grantedBy: number;
  declare grantedAt: Date;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedBy: CreationOptional<number | null>;
}

export class Defect extends Model<Attrs<Defect>, Create<Defect>> {
  declare id: CreationOptional<number>;
  declare airframeId: number;
  declare description: string;
  declare chapter: string | null;
  declare source: 'finding' | 'check_note' | 'raised';
  declare checkId: string | null;
  declare holdId: number | null;
  declare needsIndependentInspection: boolean;
  declare raisedBy: number;
  declare raisedAt: Date;
  declare contentHash: string;
  declare signedContent: string;
}

export class DefectEntry extends Model<Attrs<DefectEntry>, Create<DefectEntry>> {
  declare id: CreationOptional<number>;
  declare defectId: number;
  declare kind: 'work' | 'inspection' | 'certification' | 'deferral';
  declare text: string;
  declare independentInspection: boolean;
  /** JSON of the signer's authorisation at signing, for a certification or a deferral. */
  declare authorisation: string | null;
  declare category: 'A' | 'B' | 'C' | 'D' | null;
  declare reference: string | null;
  declare limitAt: Date | null;
  declare limitHours: string | number | null;
  declare limitFlights: number | null;
  declare signedBy: number;
  declare signedAt: Date;
  declare signedWith: 'pin' | 'password';
  declare contentHash: string;
  declare signedContent: string;
}

export class AirframeRelease extends Model<Attrs<AirframeRelease>, Create<AirframeRelease>> {
  declare id: CreationOptional<number>;
  declare airframeId: number;
  declare statement: string;
  /** JSON array of the ATA chapters of the work certified. */
  declare chapters: string;
  declare authorisation: string;
  declare signedBy: number;
  declare signedAt: Date;
  declare signedWith: 'pin' | 'password';
  declare contentHash: string;
  declare signedContent: string;
  /** The id the screen gave this act of signing (migration 0017): a resend is answered as the first. */
  declare requestId: CreationOptional<string | null>;
}

/** Authorisations, the tech log's defects and entries, and certificates of release. */
function initAirworthinessModels(sequelize: Sequelize) {
  const opts = (tableName: string) => tableOptions(sequelize, tableName);
  StaffAuthorisation.init(
    {
      id,
      staffId: ref,
      category: DataTypes.ENUM('A', 'B1', 'B2', 'B3', 'C'),
      typeCodes: DataTypes.TEXT,
      scope: DataTypes.TEXT,
      expiresOn: DataTypes.DATEONLY,
      reference: DataTypes.STRING,
      grantedBy: ref,
      grantedAt: instant,
      revokedAt: instant,
      revokedBy: ref,
    },
    opts('staff_authorisations'),
  );
  Defect.init(
    {
      id,
      airframeId: ref,
      description: DataTypes.TEXT,
      chapter: DataTypes.STRING,
      source: DataTypes.ENUM('finding', 'check_note', 'raised'),
      checkId: uuid,
      holdId: ref,
      needsIndependentInspection: DataTypes.BOOLEAN,
      raisedBy: ref,
      raisedAt: instant,
      contentHash: sha256Hex,
      signedContent: longText,
    },
    opts('defects'),
  );
  DefectEntry.init(
    {
      id,
      defectId: ref,
      kind: DataTypes.ENUM('work', 'inspection', 'certification', 'deferral'),
      text: DataTypes.TEXT,
      independentInspection: DataTypes.BOOLEAN,
      authorisation: DataTypes.TEXT,
      category: DataTypes.ENUM('A', 'B', 'C', 'D'),
      reference: DataTypes.STRING,
      limitAt: instant,
      limitHours: DataTypes.DECIMAL(10, 1),
      limitFlights: ref,
      ...signature,
    },
    opts('defect_entries'),
  );
  AirframeRelease.init(
    {
      id,
      airframeId: ref,
      statement: DataTypes.TEXT,
      chapters: DataTypes.TEXT,
      authorisation: DataTypes.TEXT,
      ...signature,
      requestId: uuid,
    },
    opts('airframe_releases'),
  );
}
