import { DataTypes, type Model } from 'sequelize';

/** A tempo column: DECIMAL(6,2) in MariaDB, which the driver returns as a string; a number everywhere else. */
export const decimalBpm = (name: string, allowNull = true) => ({
  type: DataTypes.DECIMAL(6, 2),
  allowNull,
  get(this: Model) {
    const raw = this.getDataValue(name) as string | number | null;
    return raw === null || raw === undefined ? null : Number(raw);
  },
});
