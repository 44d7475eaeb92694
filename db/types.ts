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

export interface Database {
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
}

export type UserRow = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type BlockRow = Selectable<BlocksTable>;
export type NewBlock = Insertable<BlocksTable>;
export type BlockUpdate = Updateable<BlocksTable>;
