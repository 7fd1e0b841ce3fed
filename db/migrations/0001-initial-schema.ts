import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The first schema of Rhotrace. Units are fixed per column and named in the column
 * (`_k` kelvin, `_cm` centimetres, `_ohm_cm` ohm centimetres, `_ohm_sq` ohm per square).
 * JSON documents are stored as LONGTEXT and parsed by the models.
 */
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false };
const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const ref = (table: string, allowNull = false, onDelete = 'RESTRICT') => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const text = (allowNull = true) => ({ type: DataTypes.TEXT, allowNull });
const json = (allowNull = true) => ({ type: DataTypes.TEXT('long'), allowNull });
const double = (allowNull = true) => ({ type: DataTypes.DOUBLE, allowNull });

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    role: {
      type: DataTypes.ENUM('admin', 'manager', 'engineer', 'physicist', 'technician'),
      allowNull: false,
    },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    // Raised on deactivation and password change, so older tokens stop working.
    token_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });

  await qi.createTable('password_resets', {
    id,
    user_id: ref('users', false, 'CASCADE'),
    token_sha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    used_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });

  await qi.createTable('sign_in_throttles', {
    // sha256 of `account:<email>` or `address:<ip>`
    key_sha256: { type: DataTypes.CHAR(64), primaryKey: true, allowNull: false },
    failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    first_failure_at: { type: DataTypes.DATE(3), allowNull: false },
    locked_until: { type: DataTypes.DATE(3), allowNull: true },
  });

  await qi.createTable('lots', {
    id,
    code: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    material: { type: DataTypes.STRING(16), allowNull: false },
    dopant: { type: DataTypes.STRING(8), allowNull: true },
    dopant_type: { type: DataTypes.ENUM('n', 'p'), allowNull: true },
    orientation: { type: DataTypes.STRING(16), allowNull: true },
    diameter_cm: double(),
    thickness_cm: double(),
    supplier: { type: DataTypes.STRING(200), allowNull: true },
    received_on: { type: DataTypes.DATEONLY, allowNull: true },
    spec_min_ohm_cm: double(),
    spec_max_ohm_cm: double(),
    notes: text(),
    created_by_id: ref('users', true, 'SET NULL'),
    deleted_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });

  await qi.createTable('wafers', {
    id,
    lot_id: ref('lots'),
    number: { type: DataTypes.STRING(32), allowNull: false },
    thickness_cm: double(),
    state: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'received' },
    notes: text(),
    deleted_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('wafers', ['lot_id', 'number'], { unique: true, name: 'wafers_lot_number' });

  await qi.createTable('stations', {
    id,
    name: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    probe_spacing_cm: double(false),
    tip_radius_cm: double(),
    thermometer: { type: DataTypes.ENUM('thermocouple', 'platinum-rtd'), allowNull: false },
    rtd_r0_ohm: double(),
    min_temperature_k: double(false),
    max_temperature_k: double(false),
    calibrated_on: { type: DataTypes.DATEONLY, allowNull: true },
    notes: text(),
    deleted_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });

  await qi.createTable('assignments', {
    id,
    wafer_id: ref('wafers'),
    assignee_id: ref('users'),
    assigned_by_id: ref('users'),
    task: { type: DataTypes.STRING(500), allowNull: false },
    due_date: { type: DataTypes.DATEONLY, allowNull: false },
    state: {
      type: DataTypes.ENUM('assigned', 'in progress', 'done', 'cancelled'),
      allowNull: false,
      defaultValue: 'assigned',
    },
    notes: text(),
    ...timestamps,
  });
  await qi.addIndex('assignments', ['assignee_id', 'state']);
  await qi.addIndex('assignments', ['wafer_id']);

  await qi.createTable('raw_files', {
    storage_key: { type: DataTypes.STRING(64), primaryKey: true, allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    content: { type: DataTypes.BLOB('long'), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });

  await qi.createTable('sweeps', {
    id,
    wafer_id: ref('wafers'),
    station_id: ref('stations', true),
    method: { type: DataTypes.STRING(24), allowNull: false },
    geometry: json(false),
    uploaded_by_id: ref('users'),
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_kind: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'db' },
    storage_key: { type: DataTypes.STRING(255), allowNull: false },
    column_mapping: json(false),
    metadata: json(),
    parse_report: json(false),
    point_count: { type: DataTypes.INTEGER, allowNull: false },
    min_temperature_k: double(),
    max_temperature_k: double(),
    deleted_at: { type: DataTypes.DATE(3), allowNull: true },
    deleted_by_id: ref('users', true),
    ...timestamps,
  });
  await qi.addIndex('sweeps', ['wafer_id', 'sha256'], { name: 'sweeps_wafer_sha256' });

  await qi.createTable('sweep_points', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true, allowNull: false },
    sweep_id: ref('sweeps', false, 'CASCADE'),
    sequence: { type: DataTypes.INTEGER, allowNull: false },
    source_row: { type: DataTypes.INTEGER, allowNull: false },
    temperature_k: double(false),
    current_a: double(),
    voltage_v: double(),
    resistance_ohm: double(),
    sheet_resistance_ohm_sq: double(),
    resistivity_ohm_cm: double(false),
    raw: json(false),
    flags: { type: DataTypes.STRING(255), allowNull: false, defaultValue: '' },
  });
  await qi.addIndex('sweep_points', ['sweep_id', 'sequence'], {
    unique: true,
    name: 'sweep_points_sweep_sequence',
  });

  await qi.createTable('fits', {
    id,
    sweep_id: ref('sweeps'),
    kind: { type: DataTypes.STRING(24), allowNull: false },
    inputs: json(false),
    window_min_k: double(),
    window_max_k: double(),
    parameters: json(false),
    standard_errors: json(false),
    confidence_intervals: json(false),
    goodness: json(false),
    residuals: json(false),
    converged: { type: DataTypes.BOOLEAN, allowNull: false },
    reason: text(),
    reading: text(),
    model_version: { type: DataTypes.STRING(32), allowNull: false },
    created_by_id: ref('users'),
    deleted_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('fits', ['sweep_id']);

  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true, allowNull: false },
    actor_id: ref('users', true, 'SET NULL'),
    action: { type: DataTypes.STRING(24), allowNull: false },
    entity: { type: DataTypes.STRING(32), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: false },
    before: json(),
    after: json(),
    request_id: { type: DataTypes.STRING(64), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('audit_events', ['entity', 'entity_id']);

  await qi.createTable('outgoing_emails', {
    id,
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    text_body: text(false),
    html_body: text(false),
    state: { type: DataTypes.ENUM('queued', 'sent', 'failed'), allowNull: false },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_error: text(),
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    related_entity: { type: DataTypes.STRING(32), allowNull: true },
    related_id: { type: DataTypes.STRING(64), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('outgoing_emails', ['state', 'next_attempt_at']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const table of [
    'outgoing_emails',
    'audit_events',
    'fits',
    'sweep_points',
    'sweeps',
    'raw_files',
    'assignments',
    'stations',
    'wafers',
    'lots',
    'sign_in_throttles',
    'password_resets',
    'users',
  ]) {
    await qi.dropTable(table);
  }
}
