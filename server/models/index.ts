/**
 * Initialises every model on a Sequelize instance and declares all
 * associations in one place. Models are module-level classes, so one
 * process works with one Sequelize instance at a time (the last one
 * initialised).
 */
import type { Sequelize } from 'sequelize';
import { Comment, initComment } from './comment.ts';
import { Invitation, initInvitation } from './invitation.ts';
import { Membership, initMembership } from './membership.ts';
import { PasswordReset, initPasswordReset } from './password-reset.ts';
import { Pattern, initPattern } from './pattern.ts';
import { Revision, initRevision } from './revision.ts';
import { Upload, initUpload } from './upload.ts';
import { User, initUser } from './user.ts';

export { Comment, Invitation, Membership, PasswordReset, Pattern, Revision, Upload, User };
export type { GlobalRole } from './user.ts';
export type { MemberRole } from './membership.ts';
export type { PatternStatus } from './pattern.ts';

/** Initialises models and associations on `sequelize`. */
export function initModels(sequelize: Sequelize): void {
  initUser(sequelize);
  initPattern(sequelize);
  initRevision(sequelize);
  initMembership(sequelize);
  initInvitation(sequelize);
  initPasswordReset(sequelize);
  initComment(sequelize);
  initUpload(sequelize);

  User.hasMany(Pattern, { foreignKey: 'ownerId', as: 'ownedPatterns' });
  Pattern.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });

  Pattern.hasMany(Revision, { foreignKey: 'patternId', as: 'revisions', onDelete: 'CASCADE' });
  Revision.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  Revision.belongsTo(User, { foreignKey: 'authorId', as: 'author' });

  Pattern.hasMany(Membership, { foreignKey: 'patternId', as: 'memberships', onDelete: 'CASCADE' });
  Membership.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });

  Invitation.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });

  PasswordReset.belongsTo(User, { foreignKey: 'userId', as: 'user' });

  Comment.belongsTo(Revision, { foreignKey: 'revisionId', as: 'revision' });
  Comment.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  Revision.hasMany(Comment, { foreignKey: 'revisionId', as: 'comments' });

  Upload.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
  Upload.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
}
