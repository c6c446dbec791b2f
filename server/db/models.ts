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

export class Session extends Model<Attrs<Session>, Create<Session>> {
  declare sid: string;
  declare expires: Date | null;
  declare data: string | null;
}

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const createdAt = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };

export function initModels(sequelize: Sequelize) {
  const opts = (tableName: string) => ({ sequelize, tableName, underscored: true, timestamps: false });
  Base.init({ id, code: DataTypes.STRING, name: DataTypes.STRING }, opts('bases'));
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
      lockedUntil: DataTypes.DATE(3),
      mustChangePin: { type: DataTypes.BOOLEAN, defaultValue: false },
      active: { type: DataTypes.BOOLEAN, defaultValue: true },
      createdAt,
    },
    opts('staff'),
  );
  LimitsVersion.init(
    {
      id,
      typeId: DataTypes.INTEGER.UNSIGNED,
      version: DataTypes.INTEGER,
      status: DataTypes.ENUM('draft', 'published'),
      definition: DataTypes.TEXT('long'),
      publishedAt: DataTypes.DATE(3),
      publishedBy: DataTypes.INTEGER.UNSIGNED,
      createdAt,
    },
    opts('limits_versions'),
  );
  Airframe.init(
    {
      id,
      fleetNumber: DataTypes.STRING,
      serial: DataTypes.STRING,
      typeId: DataTypes.INTEGER.UNSIGNED,
      baseId: DataTypes.INTEGER.UNSIGNED,
      hours: { type: DataTypes.DECIMAL(10, 1), defaultValue: 0 },
      flights: { type: DataTypes.INTEGER.UNSIGNED, defaultValue: 0 },
      active: { type: DataTypes.BOOLEAN, defaultValue: true },
      createdAt,
    },
    opts('airframes'),
  );
  Tag.init(
    {
      id,
      airframeId: DataTypes.INTEGER.UNSIGNED,
      token: DataTypes.STRING,
      issuedAt: DataTypes.DATE(3),
      revokedAt: DataTypes.DATE(3),
    },
    opts('tags'),
  );
  KioskDevice.init(
    {
      id,
      name: DataTypes.STRING,
      tokenHash: DataTypes.CHAR(64),
      enrolCodeHash: DataTypes.CHAR(64),
      enrolExpiresAt: DataTypes.DATE(3),
      enrolledAt: DataTypes.DATE(3),
      revokedAt: DataTypes.DATE(3),
      lastSeenAt: DataTypes.DATE(3),
      createdBy: DataTypes.INTEGER.UNSIGNED,
      createdAt,
    },
    opts('kiosk_devices'),
  );
  Check.init(
    {
      id: { type: DataTypes.CHAR(36), primaryKey: true },
      airframeId: DataTypes.INTEGER.UNSIGNED,
      kind: DataTypes.ENUM('pre_flight', 'ground_run', 'after_flight', 'servicing'),
      limitsVersionId: DataTypes.INTEGER.UNSIGNED,
      context: DataTypes.TEXT,
      verdict: DataTypes.ENUM('in_limits', 'service', 'out_of_limits'),
      note: DataTypes.TEXT,
      airframeHours: DataTypes.DECIMAL(10, 1),
      signedBy: DataTypes.INTEGER.UNSIGNED,
      signedAt: DataTypes.DATE(3),
      contentHash: DataTypes.CHAR(64),
      signedContent: DataTypes.TEXT('long'),
      submissionHash: DataTypes.CHAR(64),
      correctsCheckId: DataTypes.CHAR(36),
      kioskDeviceId: DataTypes.INTEGER.UNSIGNED,
      createdAt,
    },
    opts('checks'),
  );
  Reading.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      checkId: DataTypes.CHAR(36),
      seq: DataTypes.INTEGER,
      checkpointCode: DataTypes.STRING,
      entry: DataTypes.TEXT,
      value: DataTypes.DOUBLE,
      unit: DataTypes.STRING,
      verdict: DataTypes.ENUM('in_limits', 'service', 'out_of_limits'),
      bandId: DataTypes.STRING,
      message: DataTypes.TEXT,
      action: DataTypes.TEXT,
      expected: DataTypes.DOUBLE,
    },
    opts('readings'),
  );
  Hold.init(
    {
      id,
      airframeId: DataTypes.INTEGER.UNSIGNED,
      checkId: DataTypes.CHAR(36),
      reason: DataTypes.TEXT,
      openedAt: DataTypes.DATE(3),
      releasedAt: DataTypes.DATE(3),
      releasedBy: DataTypes.INTEGER.UNSIGNED,
    },
    opts('holds'),
  );
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      at: DataTypes.DATE(3),
      actorId: DataTypes.INTEGER.UNSIGNED,
      action: DataTypes.STRING,
      entity: DataTypes.STRING,
      entityId: DataTypes.STRING,
      payload: DataTypes.TEXT('long'),
      prevHash: DataTypes.CHAR(64),
      hash: DataTypes.CHAR(64),
    },
    opts('audit_events'),
  );
  Session.init(
    { sid: { type: DataTypes.STRING(64), primaryKey: true }, expires: DataTypes.DATE, data: DataTypes.TEXT },
    opts('sessions'),
  );
  initServicingModels(sequelize);
  initLeadModels(sequelize);
  initAirworthinessModels(sequelize);
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
  /** JSON of the level reading entry before the top-up. */
  declare levelBefore: string;
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

export function initServicingModels(sequelize: Sequelize) {
  const opts = (tableName: string) => ({ sequelize, tableName, underscored: true, timestamps: false });
  ServicingEntry.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      checkId: DataTypes.CHAR(36),
      airframeId: DataTypes.INTEGER.UNSIGNED,
      checkpointCode: DataTypes.STRING,
      system: DataTypes.STRING,
      quantityL: DataTypes.DOUBLE,
      enteredValue: DataTypes.DOUBLE,
      enteredUnit: DataTypes.STRING,
      fluidSpec: DataTypes.STRING,
      batch: DataTypes.STRING,
      levelBefore: DataTypes.TEXT,
      addedAt: DataTypes.DATE(3),
    },
    opts('servicing_entries'),
  );
  Photo.init(
    {
      id: { type: DataTypes.CHAR(36), primaryKey: true },
      checkId: DataTypes.CHAR(36),
      checkpointCode: DataTypes.STRING,
      storedName: DataTypes.STRING,
      mimeType: DataTypes.STRING,
      sizeBytes: DataTypes.INTEGER.UNSIGNED,
      sha256: DataTypes.CHAR(64),
      uploadedBy: DataTypes.INTEGER.UNSIGNED,
      uploadedAt: DataTypes.DATE(3),
    },
    opts('photos'),
  );
  CheckDraft.init(
    {
      id: { type: DataTypes.CHAR(36), primaryKey: true },
      airframeId: DataTypes.INTEGER.UNSIGNED,
      kind: DataTypes.ENUM('pre_flight', 'ground_run', 'after_flight', 'servicing'),
      startedBy: DataTypes.INTEGER.UNSIGNED,
      startedAt: DataTypes.DATE(3),
      touchedAt: DataTypes.DATE(3),
      closedAt: DataTypes.DATE(3),
      closedBy: DataTypes.INTEGER.UNSIGNED,
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

export function initLeadModels(sequelize: Sequelize) {
  const opts = (tableName: string) => ({ sequelize, tableName, underscored: true, timestamps: false });
  HoldCorrectiveAction.init(
    {
      id,
      holdId: DataTypes.INTEGER.UNSIGNED,
      text: DataTypes.TEXT,
      recordedBy: DataTypes.INTEGER.UNSIGNED,
      recordedAt: DataTypes.DATE(3),
      independentInspection: { type: DataTypes.BOOLEAN, defaultValue: false },
    },
    opts('hold_corrective_actions'),
  );
  HoldCountersign.init(
    {
      id,
      holdId: DataTypes.INTEGER.UNSIGNED,
      decision: DataTypes.ENUM('release', 'keep'),
      reason: DataTypes.TEXT,
      recheckCheckId: DataTypes.CHAR(36),
      signedBy: DataTypes.INTEGER.UNSIGNED,
      signedAt: DataTypes.DATE(3),
      signedWith: DataTypes.ENUM('pin', 'password'),
      contentHash: DataTypes.CHAR(64),
      signedContent: DataTypes.TEXT('long'),
      authorisation: DataTypes.TEXT,
      legacy: { type: DataTypes.BOOLEAN, defaultValue: false },
    },
    opts('hold_countersigns'),
  );
  Acceptance.init(
    {
      id,
      airframeId: DataTypes.INTEGER.UNSIGNED,
      acceptedBy: DataTypes.INTEGER.UNSIGNED,
      acceptedAt: DataTypes.DATE(3),
      checkIds: DataTypes.TEXT,
      contentHash: DataTypes.CHAR(64),
      signedContent: DataTypes.TEXT('long'),
    },
    opts('acceptances'),
  );
  BoardLink.init(
    {
      id,
      name: DataTypes.STRING,
      tokenHash: DataTypes.CHAR(64),
      createdBy: DataTypes.INTEGER.UNSIGNED,
      createdAt,
      revokedAt: DataTypes.DATE(3),
      revokedBy: DataTypes.INTEGER.UNSIGNED,
      lastSeenAt: DataTypes.DATE(3),
    },
    opts('board_links'),
  );
  MailDelivery.init(
    {
      id,
      topic: DataTypes.STRING,
      topicKey: DataTypes.STRING,
      recipients: DataTypes.TEXT,
      subject: DataTypes.STRING,
      text: DataTypes.TEXT('long'),
      status: DataTypes.ENUM('pending', 'sent', 'failed'),
      error: DataTypes.TEXT,
      createdAt,
      sentAt: DataTypes.DATE(3),
      attempts: { type: DataTypes.INTEGER.UNSIGNED, defaultValue: 1 },
      lastAttemptAt: DataTypes.DATE(3),
    },
    opts('mail_deliveries'),
  );
  CaughtMail.init(
    {
      id,
      recipients: DataTypes.TEXT,
      sender: DataTypes.STRING,
      subject: DataTypes.STRING,
      text: DataTypes.TEXT('long'),
      receivedAt: DataTypes.DATE(3),
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
}

export function initAirworthinessModels(sequelize: Sequelize) {
  const opts = (tableName: string) => ({ sequelize, tableName, underscored: true, timestamps: false });
  const signature = {
    signedBy: DataTypes.INTEGER.UNSIGNED,
    signedAt: DataTypes.DATE(3),
    signedWith: DataTypes.ENUM('pin', 'password'),
    contentHash: DataTypes.CHAR(64),
    signedContent: DataTypes.TEXT('long'),
  };
  StaffAuthorisation.init(
    {
      id,
      staffId: DataTypes.INTEGER.UNSIGNED,
      category: DataTypes.ENUM('A', 'B1', 'B2', 'B3', 'C'),
      typeCodes: DataTypes.TEXT,
      scope: DataTypes.TEXT,
      expiresOn: DataTypes.DATEONLY,
      reference: DataTypes.STRING,
      grantedBy: DataTypes.INTEGER.UNSIGNED,
      grantedAt: DataTypes.DATE(3),
      revokedAt: DataTypes.DATE(3),
      revokedBy: DataTypes.INTEGER.UNSIGNED,
    },
    opts('staff_authorisations'),
  );
  Defect.init(
    {
      id,
      airframeId: DataTypes.INTEGER.UNSIGNED,
      description: DataTypes.TEXT,
      chapter: DataTypes.STRING,
      source: DataTypes.ENUM('finding', 'check_note', 'raised'),
      checkId: DataTypes.CHAR(36),
      holdId: DataTypes.INTEGER.UNSIGNED,
      needsIndependentInspection: DataTypes.BOOLEAN,
      raisedBy: DataTypes.INTEGER.UNSIGNED,
      raisedAt: DataTypes.DATE(3),
      contentHash: DataTypes.CHAR(64),
      signedContent: DataTypes.TEXT('long'),
    },
    opts('defects'),
  );
  DefectEntry.init(
    {
      id,
      defectId: DataTypes.INTEGER.UNSIGNED,
      kind: DataTypes.ENUM('work', 'inspection', 'certification', 'deferral'),
      text: DataTypes.TEXT,
      independentInspection: DataTypes.BOOLEAN,
      authorisation: DataTypes.TEXT,
      category: DataTypes.ENUM('A', 'B', 'C', 'D'),
      reference: DataTypes.STRING,
      limitAt: DataTypes.DATE(3),
      limitHours: DataTypes.DECIMAL(10, 1),
      limitFlights: DataTypes.INTEGER.UNSIGNED,
      ...signature,
    },
    opts('defect_entries'),
  );
  AirframeRelease.init(
    {
      id,
      airframeId: DataTypes.INTEGER.UNSIGNED,
      statement: DataTypes.TEXT,
      chapters: DataTypes.TEXT,
      authorisation: DataTypes.TEXT,
      ...signature,
    },
    opts('airframe_releases'),
  );
}
