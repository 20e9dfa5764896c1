/** A user's role on one pattern (the owner is not a member; see Pattern.ownerId). */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Pattern } from './pattern.ts';
import type { User } from './user.ts';

export const MEMBER_ROLES = ['editor', 'test-knitter', 'knitter'] as const;
export type MemberRole = (typeof MEMBER_ROLES)[number];

/** Row of `memberships`; unique per (pattern, user). */
export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  declare id: CreationOptional<number>;
  declare patternId: ForeignKey<Pattern['id']>;
  declare userId: ForeignKey<User['id']>;
  declare role: MemberRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare user?: NonAttribute<User>;
  declare pattern?: NonAttribute<Pattern>;
}

/** Binds the Membership model to `sequelize`. */
export function initMembership(sequelize: Sequelize): void {
  Membership.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    role: { type: DataTypes.ENUM(...MEMBER_ROLES), allowNull: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'memberships' });
}
