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

export interface CoatingsTable {
  id: Generated<number>;
  code: string;
  name: string;
  kind: "powder" | "e-coat";
  chemistry: string;
  colour_name: string;
  swatch_hex: string;
  specific_gravity: number | null;
  volume_solids_fraction: number | null;
  weight_solids_fraction: number | null;
  film_density_g_per_cm3: number | null;
  film_min_um: number;
  film_max_um: number;
  price_per_kg: number;
  container_kind: "box" | "drum";
  container_kg: number;
  supplier_name: string;
  supplier_email: string;
  lead_time_days: number;
  shelf_life_months: number;
  reorder_point_kg: number;
  archived_at: number | null;
  created_at: number;
  updated_at: number;
}

export interface CoatingCurePointsTable {
  id: Generated<number>;
  coating_id: number;
  metal_temp_c: number;
  hold_min: number;
}

export interface CoatingLotsTable {
  id: Generated<number>;
  coating_id: number;
  lot_number: string;
  /** epoch seconds at 00:00 UTC of the day */
  received_at: number;
  expires_at: number;
  kg_on_hand: number;
  created_at: number;
}

export interface LinesTable {
  id: Generated<number>;
  name: string;
  kind: "conveyor" | "batch";
  notes: string;
  hourly_cost: number;
  window_width_mm: number;
  window_height_mm: number;
  window_depth_mm: number;
  max_load_kg: number;
  line_speed_min_m_per_min: number | null;
  line_speed_max_m_per_min: number | null;
  line_speed_nominal_m_per_min: number | null;
  carrier_pitch_m: number | null;
  interior_width_mm: number | null;
  interior_height_mm: number | null;
  interior_depth_mm: number | null;
  racks_per_load: number | null;
  air_temp_c: number | null;
  heat_transfer_coefficient_w_per_m2k: number | null;
  load_min: number | null;
  unload_min: number | null;
  archived_at: number | null;
  created_at: number;
  updated_at: number;
}

export interface LineStagesTable {
  id: Generated<number>;
  line_id: number;
  position: number;
  name: string;
  kind: "clean" | "rinse" | "conversion" | "e-coat" | "dry-off" | "powder-booth" | "cure-oven" | "cool";
  length_m: number;
  temp_c: number | null;
  heat_transfer_coefficient_w_per_m2k: number | null;
  colour_change_min: number | null;
}

/** A measured STL upload; the file itself lives under the data folder as stored_name. */
export interface MeshesTable {
  id: string;
  file_name: string;
  stored_name: string;
  unit: "mm" | "in";
  size_bytes: number;
  format: "binary" | "ascii";
  triangle_count: number;
  area_m2: number;
  volume_m3: number;
  bbox_x_mm: number;
  bbox_y_mm: number;
  bbox_z_mm: number;
  closed: number;
  created_by: string | null;
  created_at: number;
}

/**
 * A part: area_m2 is the outside coated area (before masking), inside_area_m2 what only e-coat
 * reaches; length/width/height are the bounding box (a mesh's x, y, z). thickness_mm is the
 * section thickness that sets heat-up.
 */
export interface PartsTable {
  id: string;
  number: string;
  name: string;
  customer: string;
  material: "steel" | "stainless" | "aluminium" | "other";
  density_kg_per_m3: number;
  thickness_mm: number;
  mass_kg: number;
  /** added by 2026-12-02-parts-extra: how mass_kg was found */
  mass_origin: Generated<"volume" | "sheet" | "entered">;
  area_m2: number;
  inside_area_m2: number;
  masked_area_m2: number;
  area_origin: "mesh" | "template" | "formula" | "manual";
  template_id: string | null;
  dimensions_json: string | null;
  formula: string | null;
  length_mm: number;
  width_mm: number;
  height_mm: number;
  mesh_id: string | null;
  notes: string;
  archived: number;
  created_at: number;
  updated_at: number;
}

/** A run: part × quantity on a line, on a day (epoch seconds at 00:00 UTC) and shift. */
export interface RunsTable {
  id: Generated<number>;
  part_id: string;
  quantity: number;
  line_id: number;
  run_date: number;
  shift: number;
  /** order on the line's day board */
  sequence: number;
  /** null: the line's nominal speed */
  line_speed_m_per_min: number | null;
  clearance_mm: number;
  orientations: "any" | "upright";
  /** a forced orientation { alongWidthMm, alongHeightMm, alongDepthMm }, or null */
  orientation_json: string | null;
  parts_per_carrier_override: number | null;
  /** free text, one masking item per line */
  masking: string;
  notes: string;
  status: "draft" | "planned" | "in-progress" | "done" | "cancelled";
  /** the plan (JSON) as it stood when the run started or was cancelled; null: planned on read */
  plan_json: string | null;
  plan_frozen_at: number | null;
  created_by: string | null;
  created_at: number;
  updated_at: number;
}

/** The coats of a run in order (position 0 first). */
export interface RunCoatsTable {
  id: Generated<number>;
  run_id: number;
  position: number;
  coating_id: number;
  film_um: number;
  first_pass_efficiency: number | null;
  reclaim_efficiency: number | null;
}

/**
 * A saved what-if for the throughput comparison: a line, the figures changed (overrides_json:
 * lineSpeedMPerMin, carrierPitchM, partsPerCarrier, ovenLengthM, airTempC), and optionally the
 * part (from the catalogue, or the part_* fields entered by hand) and powder it was made for.
 */
export interface ScenariosTable {
  id: Generated<number>;
  name: string;
  line_id: number;
  overrides_json: string;
  part_id: string | null;
  part_area_m2: number | null;
  part_inside_area_m2: number | null;
  part_mass_kg: number | null;
  part_thickness_mm: number | null;
  part_length_mm: number | null;
  part_width_mm: number | null;
  part_height_mm: number | null;
  coating_id: number | null;
  created_by: string | null;
  created_at: number;
  updated_at: number;
  archived: number;
}

/** A temperature data logger and the column mapping last used with its files (JSON). */
export interface LoggersTable {
  id: Generated<number>;
  name: string;
  mapping_json: string;
  created_at: number;
  updated_at: number;
}

/**
 * A measured oven profile. The oven is line_id + stage_position (null for a batch oven), with the
 * stage's name as imported; series_json holds the mapped series (seconds, °C); run_id is free text.
 */
export interface OvenProfilesTable {
  id: Generated<number>;
  name: string;
  line_id: number;
  stage_position: number | null;
  stage_name: string;
  coating_id: number;
  run_id: string | null;
  logger_id: number | null;
  file_name: string;
  /** "YYYY-MM-DD", the day of the logger run */
  measured_on: string | null;
  notes: string;
  overbake_margin_k: number;
  sample_count: number;
  duration_s: number;
  probe_count: number;
  mapping_json: string;
  series_json: string;
  created_by: string | null;
  created_at: number;
}

/** Each heat-transfer coefficient fitted from a profile and stored on an oven: the history. */
export interface HeatTransferFitsTable {
  id: Generated<number>;
  line_id: number;
  stage_position: number | null;
  stage_name: string;
  profile_id: number | null;
  profile_name: string;
  probe_label: string;
  thickness_mm: number;
  h_before_w_per_m2k: number | null;
  h_after_w_per_m2k: number;
  rms_k: number;
  applied_by: string | null;
  applied_at: number;
}

/** A film-thickness gauge (ASTM D7091: type1 magnetic pull-off, type2 electronic). */
export interface GaugesTable {
  id: Generated<number>;
  name: string;
  gauge_type: "type1" | "type2";
  serial: string;
  verified_at: number | null;
  /** remembered CSV column mapping { readingColumn, spotColumn?, areaColumn?, unit, hasHeader } */
  mapping_json: string | null;
  created_at: number;
  /** months between verifications; the plant's choice (default 12) */
  verify_interval_months: Generated<number>;
  /** set when the gauge is retired (kept because film checks name it) */
  retired_at: number | null;
}

/** DFT readings of one coat of a run; readings_json: number[][][] (sspc-pa2) or number[] (iso19840), µm. */
export interface FilmChecksTable {
  id: Generated<number>;
  run_id: number;
  coat_position: number;
  rule: "sspc-pa2" | "iso19840";
  /** null: the coating's film range */
  spec_min_um: number | null;
  spec_max_um: number | null;
  nominal_um: number | null;
  gauge_id: number | null;
  readings_json: string;
  notes: string;
  created_by: string | null;
  created_at: number;
  updated_at: number;
}

/** Cure, adhesion, appearance or coverage test of a run; data_json depends on kind. */
export interface FilmTestsTable {
  id: Generated<number>;
  run_id: number;
  kind: "cure" | "adhesion" | "appearance" | "coverage";
  data_json: string;
  recorded_by: string | null;
  recorded_at: number;
}

/** Every change to film checks and tests: who, when, what, old → new. */
export interface FilmCheckLogTable {
  id: Generated<number>;
  run_id: number;
  entity: string;
  entity_id: number;
  action: string;
  user_id: string | null;
  at: number;
  old_json: string | null;
  new_json: string | null;
}

/** A purchase request sent to one supplier (by e-mail); lines below. */
export interface PurchaseRequestsTable {
  id: Generated<number>;
  reference: string;
  supplier_name: string;
  supplier_email: string;
  status: "sent" | "confirmed" | "received" | "cancelled";
  sent_at: number;
  confirmed_at: number | null;
  received_at: number | null;
  cancelled_at: number | null;
  notes: string;
  created_by: string | null;
  created_at: number;
}

export interface PurchaseRequestLinesTable {
  id: Generated<number>;
  request_id: number;
  coating_id: number;
  containers: number;
  container_kg: number;
  /** the supplier's lead time when sent: expected arrival = sent + lead time */
  lead_time_days: number;
  received_kg: number;
}

/** Powder actually used by a done run's coat, and the utilisation it implies. */
export interface MaterialUsageTable {
  id: Generated<number>;
  run_id: number;
  coat_index: number;
  line_id: number;
  coating_id: number;
  parts_coated: number;
  kg_used: number;
  area_m2: number;
  film_um: number;
  /** 1 when film_um is the measured mean, 0 the target */
  film_measured: number;
  utilisation: number;
  excluded: number;
  recorded_by: string | null;
  recorded_at: number;
}

/**
 * A saved racking plan, one per part × line: the choices, and the count / space count / limit as
 * last saved (lists show these without planning again). orientation_override is null for the
 * planner's best, else what lies along travel, up and across, e.g. "length-height-width".
 */
export interface RackPlansTable {
  id: Generated<number>;
  part_id: string;
  line_id: number;
  clearance_mm: number;
  orientations: "any" | "upright";
  orientation_override:
    | "length-height-width"
    | "width-height-length"
    | "length-width-height"
    | "width-length-height"
    | "height-width-length"
    | "height-length-width"
    | null;
  note: string;
  parts_per_carrier: number;
  space_count: number;
  limited_by: "space" | "load";
  created_by: string | null;
  updated_by: string | null;
  created_at: number;
  updated_at: number;
}

export interface Database {
  users: UsersTable;
  sessions: SessionsTable;
  auth_tokens: AuthTokensTable;
  sign_in_failures: SignInFailuresTable;
  plant_settings: PlantSettingsTable;
  mail_outbox: MailOutboxTable;
  coatings: CoatingsTable;
  coating_cure_points: CoatingCurePointsTable;
  coating_lots: CoatingLotsTable;
  lines: LinesTable;
  line_stages: LineStagesTable;
  meshes: MeshesTable;
  parts: PartsTable;
  scenarios: ScenariosTable;
  runs: RunsTable;
  run_coats: RunCoatsTable;
  gauges: GaugesTable;
  film_checks: FilmChecksTable;
  film_tests: FilmTestsTable;
  film_check_log: FilmCheckLogTable;
  loggers: LoggersTable;
  oven_profiles: OvenProfilesTable;
  heat_transfer_fits: HeatTransferFitsTable;
  purchase_requests: PurchaseRequestsTable;
  purchase_request_lines: PurchaseRequestLinesTable;
  material_usage: MaterialUsageTable;
  rack_plans: RackPlansTable;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type MailMessage = Selectable<MailOutboxTable>;
export type PlantSettings = Selectable<PlantSettingsTable>;
