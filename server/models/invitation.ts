/** An invitation to a pattern, sent by e-mail. Only the SHA-256 of the token is stored. */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import { MEMBER_ROLES, type MemberRole } from './membership.ts';
import type { Pattern } from './pattern.ts';
import type { User } from './user.ts';

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare patternId: ForeignKey<Pattern['id']>;
  declare email: string;
  declare role: MemberRole;
  declare tokenHash: string;
  declare invitedById: ForeignKey<User['id']>;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare pattern?: NonAttribute<Pattern>;
}

/** Binds the Invitation model to `sequelize` (table `invitations`). */
export function initInvitation(sequelize: Sequelize): void {
  Invitation.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM(...MEMBER_ROLES), allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    acceptedAt: { type: DataTypes.DATE(3), allowNull: true },
    acceptedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'invitations' });
}
