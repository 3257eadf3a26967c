import { sql } from "drizzle-orm";
import { blob, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from "drizzle-orm/sqlite-core";
import { QUANTITIES, ROSETTE_LIMIT_QUANTITIES } from "../lib/limits/limit";

import { ROLES } from "../lib/auth/roles";

export { ROLES, type Role } from "../lib/auth/roles";

/** A millisecond timestamp column that defaults to the moment the row is written. */
const writtenAt = (name: string) =>
  integer(name, { mode: "timestamp_ms" })
    .notNull()
    .default(sql`(cast(unixepoch('subsec') * 1000 as integer))`);

const createdAt = () => writtenAt("created_at");

export const users = sqliteTable("users", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  role: text("role", { enum: ROLES }).notNull(),
  passwordHash: text("password_hash").notNull(),
  active: integer("active", { mode: "boolean" }).notNull().default(true),
  /** Display units in the app: SI (MPa, °C) or US customary (ksi, °F); the API is always SI. */
  units: text("units", { enum: ["si", "us"] }).notNull().default("si"),
  /**
   * Goes up whenever every session of the user must end (password set, role changed, account
   * deactivated, "sign out everywhere"); a session signed in under another number is refused.
   */
  sessionVersion: integer("session_version").notNull().default(0),
  createdAt: createdAt(),
});

export const structures = sqliteTable("structures", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  code: text("code").notNull().unique(),
  name: text("name").notNull(),
  location: text("location"),
  timezone: text("timezone").notNull().default("UTC"),
  description: text("description"),
  createdAt: createdAt(),
});

export const ALERT_MAIL_MODES = ["immediate", "digest"] as const;
export type AlertMailMode = (typeof ALERT_MAIL_MODES)[number];

export const structureMembers = sqliteTable(
  "structure_members",
  {
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    /**
     * How this member wants alert e-mails about this structure: one e-mail per alert event, or
     * one summary a day. Kept on the membership because the choice is per structure.
     */
    alertMail: text("alert_mail", { enum: ALERT_MAIL_MODES }).notNull().default("immediate"),
    /**
     * How this member wants sensor-fault e-mails: null follows the role (owners in the digest, since a
     * sensor fault asks the engineer, not the owner, to act; everyone else as they happen).
     */
    sensorMail: text("sensor_mail", { enum: ALERT_MAIL_MODES }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.structureId, t.userId] }), index("structure_members_user").on(t.userId)],
);

export const TOKEN_KINDS = ["user", "logger"] as const;
export type TokenKind = (typeof TOKEN_KINDS)[number];

export const apiTokens = sqliteTable(
  "api_tokens",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    kind: text("kind", { enum: TOKEN_KINDS }).notNull(),
    /** The user a user token acts as; null for logger tokens. */
    userId: integer("user_id").references(() => users.id, { onDelete: "cascade" }),
    /** The one structure a logger token may ingest into; null for user tokens. */
    structureId: integer("structure_id").references(() => structures.id, { onDelete: "cascade" }),
    /** SHA-256 of the token: the token itself is shown once and never stored. */
    tokenHash: text("token_hash").notNull().unique(),
    /** First characters of the token, so people can tell their tokens apart in lists. */
    hint: text("hint").notNull(),
    createdById: integer("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    lastUsedAt: integer("last_used_at", { mode: "timestamp_ms" }),
    revokedAt: integer("revoked_at", { mode: "timestamp_ms" }),
  },
  (t) => [index("api_tokens_user").on(t.userId), index("api_tokens_structure").on(t.structureId)],
);

export const auditLog = sqliteTable(
  "audit_log",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    at: createdAt(),
    actorId: integer("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** Who acted, kept as text so the record survives the user's removal (e-mail or token name). */
    actorLabel: text("actor_label").notNull(),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityKey: text("entity_key").notNull(),
    structureId: integer("structure_id").references(() => structures.id, { onDelete: "set null" }),
    before: text("before", { mode: "json" }),
    after: text("after", { mode: "json" }),
  },
  (t) => [index("audit_log_entity").on(t.entityType, t.entityKey), index("audit_log_structure").on(t.structureId)],
);

/** Failed sign-ins per e-mail address, used to slow down password guessing. */
/**
 * Recent failed sign-ins, one row per account e-mail and one per client address (key
 * `address:<ip>`, which no e-mail can be). `locked_until` refuses further tries until then.
 */
export const signInFailures = sqliteTable("sign_in_failures", {
  emailKey: text("email_key").primaryKey(),
  failures: integer("failures").notNull(),
  lastFailureAt: integer("last_failure_at", { mode: "timestamp_ms" }).notNull(),
  lockedUntil: integer("locked_until", { mode: "timestamp_ms" }),
});

/** Sessions signed out before their cookie expires: a copy of the cookie must not work either. */
export const endedSessions = sqliteTable("ended_sessions", {
  sessionId: text("session_id").primaryKey(),
  /** When the cookie would have expired anyway; the row is useless after that. */
  expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
});

export type User = typeof users.$inferSelect;
export type Structure = typeof structures.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type AuditEntry = typeof auditLog.$inferSelect;


export const GAUGE_STATUSES = ["active", "retired"] as const;
export type GaugeStatus = (typeof GAUGE_STATUSES)[number];

/** Host material as stored with a gauge (E, yield and concrete's compressive strength MPa, alpha µε/°C); gauges stored before compressive strength was asked for have none. */
export type StoredMaterial = { name?: string; E: number; nu: number; alpha: number; yield?: number | null; compressiveStrength?: number | null };
export type StoredThermal =
  | { method: "none" }
  | { method: "polynomial"; coefficients: number[] }
  | { method: "cte"; gaugeCte: number | null };

/** How a gauge reports (the API's `sampling`): readings one at a time, or bursts at a fixed rate. */
export type StoredSampling =
  | { mode: "static" }
  | {
      mode: "dynamic";
      rateHz: number;
      summaryMinutes: number;
      /** Range bin width of the rainflow histograms, MPa. */
      rangeBin: number;
      trigger: { above: number | null; below: number | null; preSeconds: number; postSeconds: number } | null;
    };

export const gauges = sqliteTable(
  "gauges",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    tag: text("tag").notNull(),
    label: text("label"),
    member: text("member"),
    kind: text("kind").notNull(),
    input: text("input").notNull(),
    bridge: text("bridge"),
    gaugeFactor: real("gauge_factor").notNull(),
    loggerGaugeFactor: real("logger_gauge_factor"),
    /** Vibrating wire: multiplier from the calibration record; null means 1. */
    calibrationFactor: real("calibration_factor"),
    polarity: integer("polarity").notNull().default(1),
    /** Quarter bridge "2-wire" or "3-wire"; null where not recorded, and then lead_resistance is the arm's. */
    wiring: text("wiring"),
    leadResistance: real("lead_resistance"),
    gaugeResistance: real("gauge_resistance"),
    /** Bridge excitation in volts; null where not recorded. */
    excitationVoltage: real("excitation_voltage"),
    thermal: text("thermal", { mode: "json" }).$type<StoredThermal>().notNull(),
    material: text("material", { mode: "json" }).$type<StoredMaterial>().notNull(),
    initialStress: real("initial_stress").notNull().default(0),
    /** The reference reading in force; its history is in zero_readings. */
    zeroValue: real("zero_value").notNull(),
    zeroTemperature: real("zero_temperature"),
    zeroTime: integer("zero_time", { mode: "timestamp_ms" }).notNull(),
    expectedInterval: integer("expected_interval"),
    /** µε either side of zero the gauge is rated for, when known. */
    ratedRange: real("rated_range"),
    /** Fatigue detail category Δσ_C, MPa at 2×10⁶ cycles; null until an engineer has assessed the detail. */
    detailCategory: real("detail_category"),
    /** Static (readings) or dynamic (bursts); every gauge made before dynamic channels existed is static. */
    sampling: text("sampling", { mode: "json" })
      .$type<StoredSampling>()
      .notNull()
      .default(sql`'{"mode":"static"}'`),
    status: text("status", { enum: GAUGE_STATUSES }).notNull().default("active"),
    retiredAt: integer("retired_at", { mode: "timestamp_ms" }),
    /** The failed gauge this one replaced at the same location, so the location's record reads as one. */
    replacesGaugeId: integer("replaces_gauge_id"),
    drawingId: integer("drawing_id"),
    /** Position on the drawing as fractions of its width and height (0–1). */
    drawingX: real("drawing_x"),
    drawingY: real("drawing_y"),
    createdAt: createdAt(),
    updatedAt: integer("updated_at", { mode: "timestamp_ms" }),
  },
  (t) => [uniqueIndex("gauges_structure_tag").on(t.structureId, t.tag)],
);

export const zeroReadings = sqliteTable(
  "zero_readings",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    gaugeId: integer("gauge_id")
      .notNull()
      .references(() => gauges.id, { onDelete: "cascade" }),
    value: real("value").notNull(),
    temperature: real("temperature"),
    /** When the reference state was read on site. */
    time: integer("time", { mode: "timestamp_ms" }).notNull(),
    reason: text("reason").notNull(),
    /** "typed", or "average of the last N readings". */
    source: text("source").notNull(),
    setById: integer("set_by_id").references(() => users.id, { onDelete: "set null" }),
    setByLabel: text("set_by_label").notNull(),
    setAt: createdAt(),
  },
  (t) => [index("zero_readings_gauge").on(t.gaugeId, t.setAt)],
);

/**
 * Shunt-calibration checks of a foil gauge's bridge: a known resistor across the gauge, the output
 * the logger showed, and what the circuit says it should have shown when the check was made.
 */
export const shuntChecks = sqliteTable(
  "shunt_checks",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    gaugeId: integer("gauge_id")
      .notNull()
      .references(() => gauges.id, { onDelete: "cascade" }),
    /** When the shunt was applied on site. */
    time: integer("time", { mode: "timestamp_ms" }).notNull(),
    /** Ω across the gauge. */
    shuntResistance: real("shunt_resistance").notNull(),
    /** Change of the logger's reading with the shunt applied, in `unit`. */
    measuredOutput: real("measured_output").notNull(),
    /** What the gauge's bridge should have shown, in `unit`, from its configuration at the time. */
    expectedOutput: real("expected_output").notNull(),
    /** The gauge's input unit at the time: "mV/V" or "microstrain". */
    unit: text("unit").notNull(),
    /** µε the shunt simulates, as the gauge's conversion reads the expected output. */
    simulatedStrain: real("simulated_strain").notNull(),
    tolerancePercent: real("tolerance_percent").notNull(),
    passed: integer("passed", { mode: "boolean" }).notNull(),
    note: text("note"),
    checkedById: integer("checked_by_id").references(() => users.id, { onDelete: "set null" }),
    checkedByLabel: text("checked_by_label").notNull(),
    recordedAt: createdAt(),
  },
  (t) => [index("shunt_checks_gauge").on(t.gaugeId, t.time)],
);

export type ShuntCheck = typeof shuntChecks.$inferSelect;

export const ROSETTE_LAYOUTS = ["rectangular", "delta"] as const;

export const rosettes = sqliteTable(
  "rosettes",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    tag: text("tag").notNull(),
    layout: text("layout", { enum: ROSETTE_LAYOUTS }).notNull(),
    gaugeAId: integer("gauge_a_id").notNull().references(() => gauges.id),
    gaugeBId: integer("gauge_b_id").notNull().references(() => gauges.id),
    gaugeCId: integer("gauge_c_id").notNull().references(() => gauges.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("rosettes_structure_tag").on(t.structureId, t.tag)],
);

/** A gauge's installation photo, a drawing, a calibration certificate (PDF or image), a photo taken on a site visit. */
export const FILE_KINDS = ["photo", "drawing", "certificate", "visit-photo"] as const;
export type FileKind = (typeof FILE_KINDS)[number];

/** Uploaded images and documents; the bytes live in the storage folder under a key the server made. */
export const files = sqliteTable(
  "files",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    gaugeId: integer("gauge_id").references(() => gauges.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: FILE_KINDS }).notNull(),
    title: text("title").notNull(),
    storageKey: text("storage_key").notNull().unique(),
    contentType: text("content_type").notNull(),
    bytes: integer("bytes").notNull(),
    width: integer("width"),
    height: integer("height"),
    uploadedById: integer("uploaded_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("files_structure").on(t.structureId, t.kind), index("files_gauge").on(t.gaugeId)],
);

/**
 * One row per gauge and time (epoch ms), converted on ingest so reads never recompute.
 * Created WITHOUT ROWID in the migration: the primary key is the storage order, so a gauge's
 * readings over a range are one contiguous scan.
 */
export const readings = sqliteTable(
  "readings",
  {
    gaugeId: integer("gauge_id").notNull(),
    time: integer("t").notNull(),
    value: real("value").notNull(),
    temperature: real("temperature"),
    /** Stress-producing strain, µε. */
    strain: real("strain").notNull(),
    /** MPa, including the gauge's initial stress. */
    stress: real("stress").notNull(),
    /** Bitmask of lib/mechanics Flag. */
    flags: integer("flags").notNull().default(0),
    /**
     * Sensor-health verdict, a bitmask of lib/alerting/fault-bits (0: none). A faulty reading is
     * kept but left out of limit evaluation and roll-ups; `fault <> 0` finds them in SQL.
     */
    fault: integer("fault").notNull().default(0),
    /**
     * Measured − thermal model, µε (lib/thermal): null while the gauge has no thermal model, or
     * where the temperature the model's lag reaches back to is unknown.
     */
    residual: real("residual"),
  },
  (t) => [primaryKey({ columns: [t.gaugeId, t.time] })],
);

/** Hourly and daily min/max/sum/count per gauge, kept up to date as readings arrive (WITHOUT ROWID). */
export const rollups = sqliteTable(
  "rollups",
  {
    gaugeId: integer("gauge_id").notNull(),
    /** Bucket width in ms: 3 600 000 (hour) or 86 400 000 (day). */
    resolution: integer("resolution").notNull(),
    bucket: integer("bucket").notNull(),
    count: integer("count").notNull(),
    strainMin: real("strain_min").notNull(),
    strainMax: real("strain_max").notNull(),
    strainSum: real("strain_sum").notNull(),
    stressMin: real("stress_min").notNull(),
    stressMax: real("stress_max").notNull(),
    stressSum: real("stress_sum").notNull(),
    temperatureCount: integer("temperature_count").notNull(),
    temperatureMin: real("temperature_min"),
    temperatureMax: real("temperature_max"),
    temperatureSum: real("temperature_sum"),
    /** Thermal residual, µε: its own count, like temperature, since readings before a model (or without a lagged temperature) have none. */
    residualCount: integer("residual_count").notNull().default(0),
    residualMin: real("residual_min"),
    residualMax: real("residual_max"),
    residualSum: real("residual_sum"),
  },
  (t) => [primaryKey({ columns: [t.gaugeId, t.resolution, t.bucket] })],
);

/**
 * The thermal model in force for a gauge (one per gauge; the audit trail keeps the ones it
 * replaced): stress-producing strain = intercept + slope·T(t − lag) (+ drift·days since
 * drift_origin), fitted by least squares over [period_from, period_to].
 */
export const thermalModels = sqliteTable("thermal_models", {
  gaugeId: integer("gauge_id")
    .primaryKey()
    .references(() => gauges.id, { onDelete: "cascade" }),
  periodFrom: integer("period_from", { mode: "timestamp_ms" }).notNull(),
  periodTo: integer("period_to", { mode: "timestamp_ms" }).notNull(),
  /** What the engineer asked for: a fixed lag, or the best fit searched up to max_lag_minutes. */
  lagSearch: text("lag_search", { enum: ["fixed", "auto"] }).notNull(),
  maxLagMinutes: integer("max_lag_minutes"),
  /** µε */
  intercept: real("intercept").notNull(),
  /** µε/°C */
  slope: real("slope").notNull(),
  lagMinutes: integer("lag_minutes").notNull(),
  /** µε/day; null without a drift term. */
  drift: real("drift"),
  driftOrigin: integer("drift_origin", { mode: "timestamp_ms" }).notNull(),
  r2: real("r2").notNull(),
  /** µε */
  residualStd: real("residual_std").notNull(),
  readings: integer("readings").notNull(),
  /** °C: the temperature range the fit saw, inside which the model holds. */
  temperatureMin: real("temperature_min").notNull(),
  temperatureMax: real("temperature_max").notNull(),
  fittedById: integer("fitted_by_id").references(() => users.id, { onDelete: "set null" }),
  fittedByLabel: text("fitted_by_label").notNull(),
  fittedAt: writtenAt("fitted_at"),
});

export type ThermalModelRow = typeof thermalModels.$inferSelect;

/**
 * One row per burst a dynamic gauge sent, identified by (gauge, start) as the contract says: the
 * key that makes a resend a duplicate and lets an overlapping burst be found. The samples
 * themselves live only in the summaries and the events (WITHOUT ROWID).
 */
export const bursts = sqliteTable(
  "bursts",
  {
    gaugeId: integer("gauge_id").notNull(),
    /** Epoch ms of the first sample. */
    start: integer("start").notNull(),
    /** Epoch ms just after the last sample: start + samples / rate. */
    end: real("end").notNull(),
    samples: integer("samples").notNull(),
    temperature: real("temperature"),
    receivedAt: writtenAt("received_at"),
  },
  (t) => [primaryKey({ columns: [t.gaugeId, t.start] })],
);

/**
 * A dynamic gauge's stress (MPa) over one summary interval, merged as bursts arrive (WITHOUT
 * ROWID). `m2` is the sum of squared deviations from the mean, which merges exactly;
 * `histogram` the rainflow ranges in the gauge's bins (lib/dynamic's compact encoding).
 */
export const burstSummaries = sqliteTable(
  "burst_summaries",
  {
    gaugeId: integer("gauge_id").notNull(),
    start: integer("start").notNull(),
    /** Interval length, ms: kept per row so a change of the gauge's interval leaves older rows readable. */
    length: integer("length").notNull(),
    samples: integer("samples").notNull(),
    min: real("min").notNull(),
    max: real("max").notNull(),
    mean: real("mean").notNull(),
    m2: real("m2").notNull(),
    maxRange: real("max_range").notNull(),
    cycles: real("cycles").notNull(),
    histogram: blob("histogram", { mode: "buffer" }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.gaugeId, t.start] })],
);

/**
 * What a dynamic gauge's newest burst leaves for the next: the rainflow residue and the event
 * capture's recent samples and open event, so counting and capture run on as over one signal.
 */
export const dynamicStates = sqliteTable("dynamic_states", {
  gaugeId: integer("gauge_id")
    .primaryKey()
    .references(() => gauges.id, { onDelete: "cascade" }),
  /** Epoch ms just after the newest burst's last sample. */
  end: real("end").notNull(),
  /** lib/fatigue's RainflowResidue. */
  residue: text("residue", { mode: "json" }).$type<{ reversals: number[]; candidate: number | null; direction: number }>().notNull(),
  captureNextTime: real("capture_next_time"),
  /** Float32 stress of the last preSeconds. */
  captureRecent: blob("capture_recent", { mode: "buffer" }),
  /** An event waiting for its postSeconds: its fields, and its samples so far as Float32. */
  openEvent: text("open_event", { mode: "json" }).$type<{ start: number; trigger: "above" | "below"; peak: number; peakAt: number; quietSamples: number }>(),
  openEventStress: blob("open_event_stress", { mode: "buffer" }),
});

/** A waveform captured around a trigger crossing, Float32 little-endian stress (MPa) at `rateHz`. */
export const dynamicEvents = sqliteTable(
  "dynamic_events",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    gaugeId: integer("gauge_id")
      .notNull()
      .references(() => gauges.id, { onDelete: "cascade" }),
    /** Epoch ms of the first and just after the last sample kept (fractions of a ms at odd rates). */
    start: real("start").notNull(),
    end: real("end").notNull(),
    rateHz: real("rate_hz").notNull(),
    trigger: text("trigger", { enum: ["above", "below"] }).notNull(),
    /** The level crossed, MPa, as it was when the event was captured. */
    triggerLevel: real("trigger_level").notNull(),
    peak: real("peak").notNull(),
    peakAt: real("peak_at").notNull(),
    truncated: integer("truncated", { mode: "boolean" }).notNull().default(false),
    waveform: blob("waveform", { mode: "buffer" }).notNull(),
    /** The engineer's word for what it was, e.g. "heavy vehicle" or "false trigger". */
    label: text("label"),
    labelledById: integer("labelled_by_id").references(() => users.id, { onDelete: "set null" }),
    labelledAt: integer("labelled_at", { mode: "timestamp_ms" }),
  },
  (t) => [index("dynamic_events_gauge").on(t.gaugeId, t.start), index("dynamic_events_structure").on(t.structureId, t.start)],
);

/**
 * A diagnostic load test recorded by an engineer: the window the load stood on the structure and
 * what it was. Results are worked out when read, from the readings stored then, so a logger file
 * uploaded after the test counts.
 */
export const loadTests = sqliteTable(
  "load_tests",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    /** What loaded the structure, where and when. */
    load: text("load").notNull(),
    /** Epoch ms; `end` is excluded. */
    start: integer("start").notNull(),
    end: integer("end").notNull(),
    createdById: integer("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdByLabel: text("created_by_label").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("load_tests_structure").on(t.structureId, t.start)],
);

/** The model's predicted peak strain of each gauge in a load test, µε (tension positive). */
export const loadTestPredictions = sqliteTable(
  "load_test_predictions",
  {
    loadTestId: integer("load_test_id")
      .notNull()
      .references(() => loadTests.id, { onDelete: "cascade" }),
    gaugeId: integer("gauge_id")
      .notNull()
      .references(() => gauges.id, { onDelete: "cascade" }),
    predicted: real("predicted").notNull(),
  },
  (t) => [primaryKey({ columns: [t.loadTestId, t.gaugeId] })],
);

export type LoadTest = typeof loadTests.$inferSelect;

/**
 * A calibration certificate of a gauge or of a logger. Loggers are known to Hookeline only through
 * their tokens, which are revoked and made anew when one leaks, so a logger's certificate names it
 * (its token's name or its serial number) rather than pointing at a token. Dates are calendar days
 * on the structure's clock, "YYYY-MM-DD", as the certificate prints them; it is valid through its
 * expiry day.
 */
export const calibrationCertificates = sqliteTable(
  "calibration_certificates",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    /** Exactly one of gauge_id and logger_name is set. */
    gaugeId: integer("gauge_id").references(() => gauges.id, { onDelete: "cascade" }),
    loggerName: text("logger_name"),
    certificateNumber: text("certificate_number").notNull(),
    issuedBy: text("issued_by").notNull(),
    issuedOn: text("issued_on").notNull(),
    expiresOn: text("expires_on").notNull(),
    fileId: integer("file_id")
      .notNull()
      .references(() => files.id),
    createdById: integer("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdByLabel: text("created_by_label").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("calibration_certificates_structure").on(t.structureId, t.expiresOn), index("calibration_certificates_gauge").on(t.gaugeId)],
);

/** Reminders queued for a certificate, one per threshold (days before expiry), so each goes out once. */
export const certificateReminders = sqliteTable(
  "certificate_reminders",
  {
    certificateId: integer("certificate_id")
      .notNull()
      .references(() => calibrationCertificates.id, { onDelete: "cascade" }),
    thresholdDays: integer("threshold_days").notNull(),
    /** Days left when it was queued: a threshold passed while no job ran is reminded late, with the true count. */
    daysLeft: integer("days_left").notNull(),
    recipients: integer("recipients").notNull(),
    queuedAt: writtenAt("queued_at"),
  },
  (t) => [primaryKey({ columns: [t.certificateId, t.thresholdDays] })],
);

/** A technician's visit to the structure: who, when, what was done. */
export const siteVisits = sqliteTable(
  "site_visits",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    /** Epoch ms of the visit. */
    visitedAt: integer("visited_at", { mode: "timestamp_ms" }).notNull(),
    /** Who went: the signed-in person by default, or the names of a crew. */
    visitor: text("visitor").notNull(),
    workDone: text("work_done").notNull(),
    createdById: integer("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdByLabel: text("created_by_label").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("site_visits_structure").on(t.structureId, t.visitedAt)],
);

/** The gauges a visit names (checked, replaced, re-zeroed …). */
export const siteVisitGauges = sqliteTable(
  "site_visit_gauges",
  {
    visitId: integer("visit_id")
      .notNull()
      .references(() => siteVisits.id, { onDelete: "cascade" }),
    gaugeId: integer("gauge_id")
      .notNull()
      .references(() => gauges.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.visitId, t.gaugeId] }), index("site_visit_gauges_gauge").on(t.gaugeId)],
);

/** Photos taken on a visit, stored as files of kind visit-photo. */
export const siteVisitPhotos = sqliteTable(
  "site_visit_photos",
  {
    visitId: integer("visit_id")
      .notNull()
      .references(() => siteVisits.id, { onDelete: "cascade" }),
    fileId: integer("file_id")
      .notNull()
      .unique()
      .references(() => files.id),
  },
  (t) => [primaryKey({ columns: [t.visitId, t.fileId] })],
);

export type CalibrationCertificate = typeof calibrationCertificates.$inferSelect;
export type SiteVisit = typeof siteVisits.$inferSelect;

export type Gauge = typeof gauges.$inferSelect;
export type BurstSummaryRow = typeof burstSummaries.$inferSelect;
export type DynamicEventRow = typeof dynamicEvents.$inferSelect;
export type ZeroReadingRow = typeof zeroReadings.$inferSelect;
export type Rosette = typeof rosettes.$inferSelect;
export type StoredFile = typeof files.$inferSelect;

/** What a gauge limit bounds; `residual` is the thermal residual (µε) of a gauge with a thermal model. */
export const LIMIT_QUANTITIES = QUANTITIES;
export const ALERT_LEVELS = ["watch", "warning", "critical"] as const;
export type AlertLevel = (typeof ALERT_LEVELS)[number];

/** The engineer's limits of a gauge; a PUT replaces the whole set. */
export const gaugeLimits = sqliteTable(
  "gauge_limits",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    gaugeId: integer("gauge_id")
      .notNull()
      .references(() => gauges.id, { onDelete: "cascade" }),
    quantity: text("quantity", { enum: LIMIT_QUANTITIES }).notNull(),
    level: text("level", { enum: ALERT_LEVELS }).notNull(),
    upper: real("upper"),
    lower: real("lower"),
    hysteresis: real("hysteresis").notNull().default(0),
    persistence: integer("persistence").notNull().default(1),
  },
  (t) => [uniqueIndex("gauge_limits_level").on(t.gaugeId, t.quantity, t.level)],
);

/** Where each gauge's limit and sensor-health evaluation stands between ingestion batches (plain JSON). */
export const evaluationStates = sqliteTable("evaluation_states", {
  gaugeId: integer("gauge_id")
    .primaryKey()
    .references(() => gauges.id, { onDelete: "cascade" }),
  lastTime: integer("last_time"),
  /** lib/services/alert-raising's state and its checkpoints. */
  state: text("state", { mode: "json" }).$type<unknown>().notNull(),
});

/**
 * Hourly snapshots of an evaluation state, so a late reading is evaluated from the state just
 * before it. A gauge's and a rosette's tables differ only in whose id `ownerId` holds; typed alike
 * (the name as a plain string), one set of queries serves both.
 */
function checkpointTable(name: string, ownerColumn: string, owner: () => AnySQLiteColumn) {
  return sqliteTable(
    name,
    {
      ownerId: integer(ownerColumn)
        .notNull()
        .references(owner, { onDelete: "cascade" }),
      time: integer("time").notNull(),
      state: text("state", { mode: "json" }).$type<unknown>().notNull(),
    },
    (t) => [primaryKey({ columns: [t.ownerId, t.time] })],
  );
}

export const evaluationCheckpoints = checkpointTable("evaluation_checkpoints", "gauge_id", () => gauges.id);

/** Limits on a rosette's derived stresses (MPa), evaluated on ingest like a gauge's. */
export const rosetteLimits = sqliteTable(
  "rosette_limits",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    rosetteId: integer("rosette_id")
      .notNull()
      .references(() => rosettes.id, { onDelete: "cascade" }),
    quantity: text("quantity", { enum: ROSETTE_LIMIT_QUANTITIES }).notNull(),
    level: text("level", { enum: ALERT_LEVELS }).notNull(),
    upper: real("upper"),
    lower: real("lower"),
    hysteresis: real("hysteresis").notNull().default(0),
    persistence: integer("persistence").notNull().default(1),
  },
  (t) => [uniqueIndex("rosette_limits_level").on(t.rosetteId, t.quantity, t.level)],
);

/** Where each rosette's episode machines stand between ingestion batches (lib/services/rosette-alert-raising's JSON). */
export const rosetteEvaluationStates = sqliteTable("rosette_evaluation_states", {
  rosetteId: integer("rosette_id")
    .primaryKey()
    .references(() => rosettes.id, { onDelete: "cascade" }),
  state: text("state", { mode: "json" }).$type<unknown>().notNull(),
});

export const rosetteEvaluationCheckpoints = checkpointTable("rosette_evaluation_checkpoints", "rosette_id", () => rosettes.id);

export const ALERT_KINDS = ["limit", "sensor"] as const;

export const alerts = sqliteTable(
  "alerts",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    gaugeId: integer("gauge_id")
      .notNull()
      .references(() => gauges.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: ALERT_KINDS }).notNull(),
    level: text("level", { enum: ALERT_LEVELS }).notNull(),
    /** For limit alerts: stress, strain or utilisation; sigma1, sigma2 or vonMises for a rosette's. */
    quantity: text("quantity"),
    /** Set for a rosette quantity's alert; `gaugeId` is then the rosette's gauge a, whose material it uses. */
    rosetteId: integer("rosette_id").references(() => rosettes.id, { onDelete: "cascade" }),
    /** For sensor alerts: stale, flat-line, jump or out-of-range. */
    code: text("code"),
    message: text("message"),
    openedAt: integer("opened_at", { mode: "timestamp_ms" }).notNull(),
    bound: real("bound"),
    /** The episode's furthest value so far, updated while the alert is open, and when it was read. */
    peak: real("peak"),
    peakAt: integer("peak_at", { mode: "timestamp_ms" }),
    /** How many times the episode opened: a limit alert that re-opens soon after clearing is the same episode. */
    openings: integer("openings").notNull().default(1),
    /** Set when the alert re-opened within the flapping window; its e-mails are then held to one and a summary. */
    flappingSince: integer("flapping_since", { mode: "timestamp_ms" }),
    /** When a flapping alert was found settled and its summary queued. */
    settledAt: integer("settled_at", { mode: "timestamp_ms" }),
    clearedAt: integer("cleared_at", { mode: "timestamp_ms" }),
    acknowledgedAt: integer("acknowledged_at", { mode: "timestamp_ms" }),
    acknowledgedById: integer("acknowledged_by_id").references(() => users.id, { onDelete: "set null" }),
    comment: text("comment"),
  },
  (t) => [index("alerts_structure").on(t.structureId, t.openedAt), index("alerts_gauge").on(t.gaugeId, t.kind, t.clearedAt)],
);

/** What happened to an alert: opened, escalated, cleared, acknowledged, note. */
export const alertEvents = sqliteTable(
  "alert_events",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    alertId: integer("alert_id")
      .notNull()
      .references(() => alerts.id, { onDelete: "cascade" }),
    type: text("type").notNull(),
    at: integer("at", { mode: "timestamp_ms" }).notNull(),
    level: text("level"),
    value: real("value"),
    byId: integer("by_id").references(() => users.id, { onDelete: "set null" }),
    byLabel: text("by_label"),
    text: text("text"),
    /** Set when the event was recorded too long after its reading to be mailed at once: the next digest carries it. */
    deferredAt: integer("deferred_at", { mode: "timestamp_ms" }),
  },
  (t) => [index("alert_events_alert").on(t.alertId, t.at), index("alert_events_deferred").on(t.deferredAt)],
);

export type GaugeLimit = typeof gaugeLimits.$inferSelect;
export type RosetteLimit = typeof rosetteLimits.$inferSelect;
export type Alert = typeof alerts.$inferSelect;
export type AlertEvent = typeof alertEvents.$inferSelect;

export const MAIL_KINDS = ["alert", "digest", "invitation", "password-reset", "report", "sign-in-lock", "certificate-reminder"] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

export const MAIL_STATES = ["queued", "sending", "sent", "failed"] as const;
export type MailState = (typeof MAIL_STATES)[number];

/** A file sent with a message, carried in the outbox row itself. */
export type MailAttachment = { filename: string; contentType: string; contentBase64: string };

/**
 * Messages waiting for, or done with, the outbox sender (jobs/outbox-sender.ts). Rows are written
 * in the transaction of whatever caused the message, so the two commit or roll back together.
 */
/** One delivery attempt of an outbox message: when, how it ended, and the relay's answer. */
export type MailAttempt = { at: string | null; outcome: "sent" | "refused" | "later" | "relay" | "failed"; answer?: string };

export const mailOutbox = sqliteTable(
  "mail_outbox",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    toAddress: text("to_address").notNull(),
    toUserId: integer("to_user_id").references(() => users.id, { onDelete: "set null" }),
    kind: text("kind", { enum: MAIL_KINDS }).notNull(),
    /** Names the message for its purpose and recipient: queuing the same key again is a no-op. */
    dedupeKey: text("dedupe_key").notNull().unique(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    attachments: text("attachments", { mode: "json" }).$type<MailAttachment[]>(),
    state: text("state", { enum: MAIL_STATES }).notNull().default("queued"),
    /** Lower is sent first: lib/mail/priority.ts. */
    priority: integer("priority").notNull().default(2),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: writtenAt("next_attempt_at"),
    /** The SMTP server's answer to the last failed attempt, or why the attempt could not be made. */
    lastError: text("last_error"),
    /** Every attempt, oldest first (lib/mail/attempt-log.ts): what the relay answered each time. */
    attemptLog: text("attempt_log", { mode: "json" }).$type<MailAttempt[]>(),
    /** Which sender holds the message and until when: another sender may take it only after that. */
    claimedBy: text("claimed_by"),
    claimedUntil: integer("claimed_until", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
    sentAt: integer("sent_at", { mode: "timestamp_ms" }),
  },
  (t) => [index("mail_outbox_due").on(t.state, t.priority, t.nextAttemptAt), index("mail_outbox_created").on(t.createdAt)],
);

/** What a caught message carried as files: their description only, not their bytes. */
export type CaughtAttachment = { filename: string | null; contentType: string; size: number };

/** Messages received by the local SMTP server (lib/mail/local-smtp-server.ts), for admins to read. */
export const caughtMail = sqliteTable(
  "caught_mail",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    receivedAt: writtenAt("received_at"),
    envelopeFrom: text("envelope_from"),
    envelopeTo: text("envelope_to", { mode: "json" }).$type<string[]>().notNull(),
    messageId: text("message_id"),
    subject: text("subject"),
    text: text("text"),
    html: text("html"),
    rawSize: integer("raw_size").notNull(),
    attachments: text("attachments", { mode: "json" }).$type<CaughtAttachment[]>().notNull(),
  },
  (t) => [index("caught_mail_received").on(t.receivedAt)],
);

/** One row per background job: who may run it until when, so several app instances run it once. */
export const jobLeases = sqliteTable("job_leases", {
  name: text("name").primaryKey(),
  holder: text("holder").notNull(),
  leaseUntil: integer("lease_until", { mode: "timestamp_ms" }).notNull(),
  lastStartedAt: integer("last_started_at", { mode: "timestamp_ms" }),
  lastFinishedAt: integer("last_finished_at", { mode: "timestamp_ms" }),
  /** The newest scheduled instant a run was started for: each instant runs once across instances. */
  lastSlot: integer("last_slot", { mode: "timestamp_ms" }),
  /** "ok: …" with the job's own summary, or "error: …". */
  lastOutcome: text("last_outcome"),
});

export type OutboxMessage = typeof mailOutbox.$inferSelect;
export type CaughtMail = typeof caughtMail.$inferSelect;
export type JobLease = typeof jobLeases.$inferSelect;
