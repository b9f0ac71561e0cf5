import { DataTypes } from 'sequelize';

/**
 * A JSON value kept in a LONGTEXT column. MariaDB's JSON type is an alias of LONGTEXT and the
 * connector hands it back as a string, so we (de)serialise explicitly and predictably.
 */
export function jsonColumn(field: string, allowNull = false) {
  return {
    type: DataTypes.TEXT('long'),
    allowNull,
    get(this: { getDataValue(key: string): unknown }) {
      const raw = this.getDataValue(field);
      return typeof raw === 'string' ? JSON.parse(raw) : raw;
    },
    set(this: { setDataValue(key: string, value: unknown): void }, value: unknown) {
      this.setDataValue(field, value === null || value === undefined ? null : JSON.stringify(value));
    },
  };
}
