import type { Generated, Selectable, Insertable } from "kysely";

/** Times are integer epoch seconds throughout. */
export type Role = "admin" | "manager" | "supervisor" | "engineer" | "purchaser" | "operator";
export type UnitSystem = "metric" | "us";

export interface UsersTable {
  id: string;
  email: string;
  name: string;
  role: Role;
  password_hash: string | null;
  active: number;
  unit_system: UnitSystem;
  created_at: number;
}

export interface SessionsTable {
  id: string;
  user_id: string;
  expires_at: number;
}

export interface AuthTokensTable {
  /** SHA-256 of the token sent by e-mail; the token itself is never stored. */
  id: string;
  user_id: string;
  kind: "invite" | "reset";
  expires_at: number;
  used_at: number | null;
  created_at: number;
}

export interface SignInFailuresTable {
  id: Generated<number>;
  key: string;
  at: number;
}

export interface PlantSettingsTable {
  id: number;
  plant_name: string;
  currency: string;
  shift_hours: number;
  default_unit_system: UnitSystem;
  updated_at: number;
}

export interface MailOutboxTable {
  id: Generated<number>;
  from_address: string;
  to_addresses: string;
  subject: string;
  text_body: string;
  received_at: number;
}

export interface Database {
  users: UsersTable;
  sessions: SessionsTable;
  auth_tokens: AuthTokensTable;
  sign_in_failures: SignInFailuresTable;
  plant_settings: PlantSettingsTable;
  mail_outbox: MailOutboxTable;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type MailMessage = Selectable<MailOutboxTable>;
export type PlantSettings = Selectable<PlantSettingsTable>;
