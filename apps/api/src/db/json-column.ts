import { DataTypes, type ModelAttributeColumnOptions, type Model } from 'sequelize';

/**
 * A LONGTEXT column holding a JSON document, parsed on read and serialised on write, so the
 * model works the same on every MariaDB version and driver setting.
 */
export function jsonColumn(field: string, allowNull = true): ModelAttributeColumnOptions<Model> {
  return {
    type: DataTypes.TEXT('long'),
    allowNull,
    get(this: Model) {
      const raw = this.getDataValue(field as never) as unknown;
      if (raw === null || raw === undefined) return null;
      return typeof raw === 'string' ? (JSON.parse(raw) as unknown) : raw;
    },
    set(this: Model, value: unknown) {
      this.setDataValue(
        field as never,
        (value === null || value === undefined ? null : JSON.stringify(value)) as never,
      );
    },
  };
}
