/** Account: unique e-mail, display name, bcrypt hash, global roles. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Global roles; access to a pattern is still checked per pattern. */
export const GLOBAL_ROLES = ['designer', 'editor', 'knitter', 'admin'] as const;
export type GlobalRole = (typeof GLOBAL_ROLES)[number];

/** Row of `users`; `passwordHash` never leaves the server (see toApiUser). */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  /** Stored comma-separated; read as an array. */
  declare roles: GlobalRole[];
  /** Bumped on password change so older session tokens stop working. */
  declare sessionVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** True when the account holds `role` globally. */
  hasRole(role: GlobalRole): boolean {
    return this.roles.includes(role);
  }
}

/** Binds the User model to `sequelize`. */
export function initUser(sequelize: Sequelize): void {
  User.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    roles: {
      type: DataTypes.STRING(200),
      allowNull: false,
      defaultValue: '',
      get(): GlobalRole[] {
        const raw = this.getDataValue('roles') as unknown as string | null;
        return (raw ?? '').split(',').filter((r): r is GlobalRole => (GLOBAL_ROLES as readonly string[]).includes(r));
      },
      set(value: GlobalRole[]) {
        this.setDataValue('roles', [...new Set(value)].join(',') as unknown as GlobalRole[]);
      },
    },
    sessionVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'users' });
}
