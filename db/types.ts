/**
 * The database as Kysely sees it. Every instant is a `timestamptz` (UTC on the wire);
 * Kysely hands them back as JS Dates. Column names are snake_case here and nowhere else:
 * the query modules under lib/ reshape rows into the app's own camelCase types.
 */
import type { ColumnType, Generated, Insertable, Selectable, Updateable } from "kysely";

export const ROLES = ["pi", "director", "observer", "night_assistant", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const BLOCK_KINDS = ["science", "engineering", "discretionary", "too", "payback"] as const;
export type BlockKind = (typeof BLOCK_KINDS)[number];

type Timestamp = ColumnType<Date, Date | string, Date | string>;
type CreatedAt = ColumnType<Date, Date | string | undefined, never>;
type Numeric = ColumnType<number, number | string, number | string>;

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string;
  disabled_at: Timestamp | null;
  created_at: CreatedAt;
}

export interface UserRolesTable {
  user_id: string;
  role: Role;
}

export interface PartnersTable {
  id: Generated<string>;
  code: string;
  name: string;
}

export interface SitesTable {
  id: Generated<string>;
  code: string;
  name: string;
  latitude_deg: Numeric;
  longitude_deg: Numeric;
  height_m: Numeric;
  time_zone: string;
}

export interface TelescopesTable {
  id: Generated<string>;
  site_id: string;
  code: string;
  name: string;
  aperture_m: Numeric;
  min_altitude_deg: Numeric;
  max_airmass: Numeric;
  sun_avoidance_deg: Numeric;
  hour_angle_min_h: Numeric;
  hour_angle_max_h: Numeric;
  setup_minutes: Generated<number>;
}

export interface TelescopeAssistantsTable {
  telescope_id: string;
  user_id: string;
}

export interface InstrumentsTable {
  id: Generated<string>;
  telescope_id: string;
  code: string;
  name: string;
  limiting_magnitude: Numeric;
}

export interface SemestersTable {
  id: Generated<string>;
  code: string;
  starts_at: Timestamp;
  ends_at: Timestamp;
}

export interface ProgramsTable {
  id: Generated<string>;
  code: string;
  title: string;
  semester_id: string;
  partner_id: string;
  pi_user_id: string;
  rank: number;
  allocated_hours: Numeric;
  category: BlockKind;
  too_allowed: Generated<boolean>;
}

export interface ProgramObserversTable {
  program_id: string;
  user_id: string;
}

export interface BlocksTable {
  id: Generated<string>;
  telescope_id: string;
  program_id: string;
  observer_user_id: string | null;
  instrument_id: string | null;
  kind: BlockKind;
  starts_at: Timestamp;
  ends_at: Timestamp;
  notes: Generated<string>;
  created_at: CreatedAt;
  updated_at: Generated<Date>;
  too_request_id: ColumnType<string | null, string | null | undefined, string | null>;
}

export interface AuditLogTable {
  id: Generated<string>;
  at: Generated<Date>;
  actor_user_id: string | null;
  action: string;
  entity: string;
  entity_id: string | null;
  details: ColumnType<unknown, string, string>;
}

export interface ApiTokensTable {
  id: Generated<string>;
  user_id: string;
  name: string;
  token_prefix: string;
  token_hash: string;
  created_at: CreatedAt;
  last_used_at: Timestamp | null;
  revoked_at: Timestamp | null;
}

export const FEED_SCOPES = ["telescope", "program", "observer"] as const;
export type FeedScope = (typeof FEED_SCOPES)[number];

export interface CalendarFeedsTable {
  id: Generated<string>;
  owner_user_id: string;
  scope: FeedScope;
  scope_id: string;
  token_hash: string;
  created_at: CreatedAt;
  revoked_at: Timestamp | null;
}

export interface RateLimitsTable {
  key: string;
  points: number;
  expire: string | null;
}

export const NOTICE_EVENTS = ["request_submitted", "decision_made", "block_displaced", "tonight_changed", "payback_scheduled", "outcome_logged", "request_lapsed", "request_returned"] as const;
export type NoticeEvent = (typeof NOTICE_EVENTS)[number];

export const DELIVERY_STATUSES = ["queued", "sending", "retrying", "sent", "failed"] as const;
export type DeliveryStatus = (typeof DELIVERY_STATUSES)[number];

export interface NotificationsTable {
  id: Generated<string>;
  user_id: string;
  event: NoticeEvent;
  notice_key: string;
  title: string;
  body: string;
  link: string;
  created_at: CreatedAt;
  read_at: Timestamp | null;
}

export interface NotificationPreferencesTable {
  user_id: string;
  event: NoticeEvent;
  email: boolean;
}

export interface EmailDeliveriesTable {
  id: Generated<string>;
  idempotency_key: string;
  user_id: string | null;
  recipient: string;
  template: NoticeEvent;
  status: Generated<DeliveryStatus>;
  attempts: Generated<number>;
  provider_id: string | null;
  last_error: string | null;
  subject: string | null;
  body_html: string | null;
  body_text: string | null;
  created_at: CreatedAt;
  updated_at: Generated<Date>;
  sent_at: Timestamp | null;
}

export const REQUEST_STATES = [
  "draft",
  "submitted",
  "in_review",
  "approved",
  "declined",
  "withdrawn",
  "lapsed",
  "executed",
  "partially_executed",
  "not_executed",
] as const;
export type RequestState = (typeof REQUEST_STATES)[number];
/** Filed and waiting for a director; a request still here when its deadline passes lapses. */
export const AWAITING_DECISION_STATES = ["submitted", "in_review"] as const satisfies readonly RequestState[];
export type AwaitingDecisionState = (typeof AWAITING_DECISION_STATES)[number];
export const REQUEST_URGENCIES = ["now", "tonight", "within_days"] as const;
export type RequestUrgency = (typeof REQUEST_URGENCIES)[number];
export const DARKNESS_LEVELS = ["civil", "nautical", "astronomical"] as const;
export type DarknessLevel = (typeof DARKNESS_LEVELS)[number];
export const TARGET_KINDS = ["fixed", "ephemeris"] as const;
export type TargetKind = (typeof TARGET_KINDS)[number];
export const ATTACHMENT_KINDS = ["finding_chart", "ephemeris", "justification", "other"] as const;
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

/** One ephemeris row as stored: UTC ISO time, ICRS RA/Dec in degrees, r and Δ in au. */
export interface StoredEphemerisRow {
  time: string;
  ra: number;
  dec: number;
  rAu?: number;
  deltaAu?: number;
  magnitude?: number;
}

export interface TooRequestsTable {
  id: Generated<string>;
  pi_user_id: string;
  program_id: string | null;
  source: ColumnType<"form" | "api", "form" | "api" | undefined, never>;
  target_name: Generated<string>;
  target_kind: ColumnType<TargetKind, TargetKind | undefined, TargetKind>;
  ra_text: Generated<string>;
  dec_text: Generated<string>;
  ra_deg: Numeric | null;
  dec_deg: Numeric | null;
  ephemeris: ColumnType<StoredEphemerisRow[] | null, string | null, string | null>;
  h_mag: Numeric | null;
  g_slope: Numeric | null;
  instrument_id: string | null;
  duration_minutes: number | null;
  earliest_start: Timestamp | null;
  latest_end: Timestamp | null;
  deadline: Timestamp | null;
  urgency: RequestUrgency | null;
  max_airmass: Numeric | null;
  darkness: ColumnType<DarknessLevel, DarknessLevel | undefined, DarknessLevel>;
  min_moon_sep_deg: Numeric | null;
  max_moon_illum: Numeric | null;
  justification: Generated<string>;
  state: ColumnType<RequestState, RequestState | undefined, RequestState>;
  feasibility: ColumnType<unknown, string | null, string | null>;
  director_note: string | null;
  created_at: CreatedAt;
  updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
  submitted_at: Timestamp | null;
}

export interface TooRequestTelescopesTable {
  request_id: string;
  telescope_id: string;
}

export interface RequestEventsTable {
  id: Generated<string>;
  request_id: string;
  at: ColumnType<Date, Date | string | undefined, never>;
  actor_user_id: string | null;
  from_state: RequestState | null;
  to_state: RequestState;
  note: ColumnType<string, string | undefined, never>;
}

export interface AttachmentsTable {
  id: Generated<string>;
  request_id: string;
  kind: AttachmentKind;
  file_name: string;
  content_type: string;
  size_bytes: number;
  storage_key: string;
  url: string;
  uploaded_by: string;
  created_at: CreatedAt;
}

export interface IdempotencyKeysTable {
  user_id: string;
  key: string;
  request_hash: string;
  status_code: number;
  response: ColumnType<unknown, string, never>;
  created_at: CreatedAt;
}

export interface Database extends DecisionLedgerTables {
  users: UsersTable;
  user_roles: UserRolesTable;
  partners: PartnersTable;
  sites: SitesTable;
  telescopes: TelescopesTable;
  telescope_assistants: TelescopeAssistantsTable;
  instruments: InstrumentsTable;
  semesters: SemestersTable;
  programs: ProgramsTable;
  program_observers: ProgramObserversTable;
  blocks: BlocksTable;
  audit_log: AuditLogTable;
  api_tokens: ApiTokensTable;
  rate_limits: RateLimitsTable;
  calendar_feeds: CalendarFeedsTable;
  notifications: NotificationsTable;
  notification_preferences: NotificationPreferencesTable;
  email_deliveries: EmailDeliveriesTable;
  too_requests: TooRequestsTable;
  too_request_telescopes: TooRequestTelescopesTable;
  request_events: RequestEventsTable;
  attachments: AttachmentsTable;
  idempotency_keys: IdempotencyKeysTable;
}

export type UserRow = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type BlockRow = Selectable<BlocksTable>;
export type NewBlock = Insertable<BlocksTable>;
export type BlockUpdate = Updateable<BlocksTable>;

export const LEDGER_KINDS = ["charge", "credit", "repay"] as const;
export type LedgerKind = (typeof LEDGER_KINDS)[number];
export const DECISIONS = ["approve", "decline", "return"] as const;
export type Decision = (typeof DECISIONS)[number];
export const SPLICE_CHANGES = ["remove", "trim-end", "trim-start", "split"] as const;
export type SpliceChange = (typeof SPLICE_CHANGES)[number];
export const SCHEDULE_CHANGE_KINDS = ["override", "displaced", "moved", "payback", "removed"] as const;
export type ScheduleChangeKind = (typeof SCHEDULE_CHANGE_KINDS)[number];
export const EXECUTION_OUTCOMES = ["executed", "partial", "aborted", "weather", "technical"] as const;
export type ExecutionOutcome = (typeof EXECUTION_OUTCOMES)[number];

export interface ConsortiumSettingsTable {
  key: string;
  value: ColumnType<unknown, string, string>;
}

export interface RequestDecisionsTable {
  id: Generated<string>;
  request_id: string;
  decision: Decision;
  telescope_id: string | null;
  slot_start: Timestamp | null;
  slot_end: Timestamp | null;
  note: Generated<string>;
  decided_by: string;
  decided_at: Generated<Date>;
}

export interface DisplacementsTable {
  id: Generated<string>;
  request_id: string;
  too_block_id: string | null;
  block_id: string;
  telescope_id: string;
  program_id: string;
  observer_user_id: string | null;
  starts_at: Timestamp;
  ends_at: Timestamp;
  minutes: Numeric;
  change: SpliceChange;
  created_at: CreatedAt;
}

export interface LedgerEntriesTable {
  id: Generated<string>;
  semester_id: string;
  program_id: string;
  partner_id: string;
  kind: LedgerKind;
  minutes: Numeric;
  request_id: string | null;
  displacement_id: string | null;
  block_id: string | null;
  note: Generated<string>;
  created_by: string | null;
  created_at: CreatedAt;
}

export interface ScheduleChangesTable {
  id: Generated<string>;
  telescope_id: string;
  at: Generated<Date>;
  kind: ScheduleChangeKind;
  block_id: string | null;
  request_id: string | null;
  starts_at: Timestamp;
  ends_at: Timestamp;
  summary: string;
}

export interface ChangeAcknowledgementsTable {
  id: Generated<string>;
  telescope_id: string;
  user_id: string;
  through_change_id: number;
  at: Generated<Date>;
}

export interface BlockExecutionsTable {
  id: Generated<string>;
  block_id: string;
  outcome: ExecutionOutcome;
  minutes_used: Numeric | null;
  note: Generated<string>;
  logged_by: string;
  logged_at: Generated<Date>;
}

export interface DecisionLedgerTables {
  consortium_settings: ConsortiumSettingsTable;
  request_decisions: RequestDecisionsTable;
  displacements: DisplacementsTable;
  ledger_entries: LedgerEntriesTable;
  schedule_changes: ScheduleChangesTable;
  change_acknowledgements: ChangeAcknowledgementsTable;
  block_executions: BlockExecutionsTable;
}
