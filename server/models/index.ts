/**
 * Initialises every model on a Sequelize instance and declares all
 * associations in one place. Models are module-level classes, so one
 * process works with one Sequelize instance at a time (the last one
 * initialised).
 */
import type { Sequelize } from 'sequelize';
import { Comment, initComment } from './comment.ts';
import { Entitlement, initEntitlement } from './entitlement.ts';
import { Invitation, initInvitation } from './invitation.ts';
import { KnittingProgress, initKnittingProgress } from './knitting-progress.ts';
import { Membership, initMembership } from './membership.ts';
import { Order, initOrder } from './order.ts';
import { PasswordReset, initPasswordReset } from './password-reset.ts';
import { Pattern, initPattern } from './pattern.ts';
import { Release, initRelease } from './release.ts';
import { ReviewEvent, initReviewEvent } from './review-event.ts';
import { PaymentEvent, initPaymentEvent } from './payment-event.ts';
import { Price, initPrice } from './price.ts';
import { Product, initProduct } from './product.ts';
import { ProductPhoto, initProductPhoto } from './product-photo.ts';
import { Revision, initRevision } from './revision.ts';
import { Upload, initUpload } from './upload.ts';
import { User, initUser } from './user.ts';

export { Comment, Invitation, KnittingProgress, Membership, PasswordReset, Pattern, Release, Revision, ReviewEvent, Upload, User };
export { Entitlement, Order, PaymentEvent, Price, Product, ProductPhoto };
export type { OrderStatus } from './order.ts';
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
  initReviewEvent(sequelize);
  initRelease(sequelize);
  initKnittingProgress(sequelize);

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

  Comment.belongsTo(Comment, { foreignKey: 'parentId', as: 'parent' });

  ReviewEvent.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  ReviewEvent.belongsTo(User, { foreignKey: 'actorId', as: 'actor' });
  ReviewEvent.belongsTo(User, { foreignKey: 'editorId', as: 'editor' });

  Release.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  Release.belongsTo(Revision, { foreignKey: 'revisionId', as: 'revision' });
  Release.belongsTo(User, { foreignKey: 'releasedById', as: 'releasedBy' });
  Pattern.hasMany(Release, { foreignKey: 'patternId', as: 'releases' });

  KnittingProgress.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  KnittingProgress.belongsTo(Release, { foreignKey: 'releaseId', as: 'release' });

  Upload.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
  Upload.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });

  // The shop (issue 9): listings, prices, photos, orders, entitlements, processed webhook events.
  initProduct(sequelize);
  initPrice(sequelize);
  initProductPhoto(sequelize);
  initOrder(sequelize);
  initEntitlement(sequelize);
  initPaymentEvent(sequelize);
  Product.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  Product.hasMany(Price, { foreignKey: 'productId', as: 'prices', onDelete: 'CASCADE' });
  Product.hasMany(ProductPhoto, { foreignKey: 'productId', as: 'photos', onDelete: 'CASCADE' });
  ProductPhoto.belongsTo(Upload, { foreignKey: 'uploadId', as: 'upload' });
  Order.belongsTo(User, { foreignKey: 'buyerId', as: 'buyer' });
  Order.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  Order.belongsTo(Product, { foreignKey: 'productId', as: 'product' });
  Entitlement.belongsTo(Pattern, { foreignKey: 'patternId', as: 'pattern' });
  Entitlement.belongsTo(Order, { foreignKey: 'orderId', as: 'order' });
}
