/** Review comments on revisions, anchored to a round and/or source lines. */
import type { ApiComment, CreateCommentBody } from '../../shared/api-schemas.ts';
import { Comment, Revision, User } from '../models/index.ts';
import { authorizePattern, visibleRevisions } from './access.ts';
import { notFound } from './errors.ts';
import { toPerson } from './serialize.ts';

/** A comment as the API shows it. */
export const toApiComment = (c: Comment, revisionNumber: number): ApiComment => ({
  id: c.id,
  revision: revisionNumber,
  author: toPerson(c.author),
  round: c.round ?? null,
  fromLine: c.fromLine ?? null,
  toLine: c.toLine ?? null,
  body: c.body,
  resolved: c.resolved ?? false,
  createdAt: c.createdAt.toISOString(),
  parentId: c.parentId ?? null,
  kind: c.kind ?? 'comment',
  size: c.size ?? null,
});

async function findRevision(patternId: number, number: number): Promise<Revision> {
  const revision = Number.isSafeInteger(number) ? await Revision.findOne({ where: { patternId, number }, attributes: ['id', 'number', 'patternId'] }) : null;
  if (!revision) throw notFound('Revision');
  return revision;
}

/** Comments on one revision, oldest first (owner and editor); replies carry `parentId`. */
export async function listComments(user: User | null, patternId: number, number: number): Promise<ApiComment[]> {
  const { pattern, role } = await authorizePattern(user, patternId, 'comment');
  const visible = visibleRevisions(role, pattern);
  if (visible !== 'all' && !visible.includes(number)) throw notFound('Revision');
  const revision = await findRevision(pattern.id, number);
  const comments = await Comment.findAll({ where: { revisionId: revision.id }, include: [{ model: User, as: 'author' }], order: [['id', 'ASC']] });
  return comments.map((c) => toApiComment(c, revision.number));
}

/** Adds a comment to a revision (owner and editor). */
export async function addComment(user: User | null, patternId: number, number: number, body: CreateCommentBody): Promise<ApiComment> {
  const { pattern } = await authorizePattern(user, patternId, 'comment');
  const revision = await findRevision(pattern.id, number);
  const comment = await Comment.create({
    revisionId: revision.id,
    authorId: (user as User).id,
    round: body.round ?? null,
    fromLine: body.fromLine ?? null,
    toLine: body.toLine ?? body.fromLine ?? null,
    body: body.body,
  });
  comment.author = user as User;
  return toApiComment(comment, revision.number);
}

async function findComment(patternId: number, commentId: number): Promise<{ comment: Comment; revision: Revision }> {
  const comment = Number.isSafeInteger(commentId) ? await Comment.findByPk(commentId, { include: [{ model: User, as: 'author' }, { model: Revision, as: 'revision', attributes: ['id', 'number', 'patternId'] }] }) : null;
  const revision = (comment as (Comment & { revision?: Revision }) | null)?.revision;
  if (!comment || !revision || revision.patternId !== patternId) throw notFound('That comment');
  return { comment, revision };
}

/**
 * Answers a comment thread (owner and editor). A reply to a reply joins the
 * thread of its first comment (threads are one level deep); the reply keeps
 * the thread's revision, round and lines.
 */
export async function replyToComment(user: User | null, patternId: number, commentId: number, body: string): Promise<ApiComment> {
  const { pattern } = await authorizePattern(user, patternId, 'comment');
  const { comment: target, revision } = await findComment(pattern.id, commentId);
  const rootId = target.parentId ?? target.id;
  const root = rootId === target.id ? target : (await Comment.findByPk(rootId)) ?? target;
  const reply = await Comment.create({
    revisionId: revision.id,
    authorId: (user as User).id,
    parentId: root.id,
    round: root.round ?? null,
    fromLine: root.fromLine ?? null,
    toLine: root.toLine ?? null,
    size: root.size ?? null,
    body,
  });
  reply.author = user as User;
  return toApiComment(reply, revision.number);
}

/** Marks a comment thread resolved or open again (owner and editor); a reply stands for its thread. */
export async function setResolved(user: User | null, patternId: number, commentId: number, resolved: boolean): Promise<ApiComment> {
  const { pattern } = await authorizePattern(user, patternId, 'comment');
  const found = await findComment(pattern.id, commentId);
  const { revision } = found;
  let { comment } = found;
  if (comment.parentId) comment = (await Comment.findByPk(comment.parentId, { include: [{ model: User, as: 'author' }] })) ?? comment;
  comment.resolved = resolved;
  await comment.save();
  return toApiComment(comment, revision.number);
}
