/** Review comments on revisions, anchored to a round and/or source lines. */
import type { ApiComment, CreateCommentBody } from '../../shared/api-schemas.ts';
import { Comment, Revision, User } from '../models/index.ts';
import { authorizePattern, visibleRevisions } from './access.ts';
import { notFound } from './errors.ts';
import { toPerson } from './serialize.ts';

const toApiComment = (c: Comment, revisionNumber: number): ApiComment => ({
  id: c.id,
  revision: revisionNumber,
  author: toPerson(c.author),
  round: c.round ?? null,
  fromLine: c.fromLine ?? null,
  toLine: c.toLine ?? null,
  body: c.body,
  resolved: c.resolved ?? false,
  createdAt: c.createdAt.toISOString(),
});

async function findRevision(patternId: number, number: number): Promise<Revision> {
  const revision = Number.isSafeInteger(number) ? await Revision.findOne({ where: { patternId, number }, attributes: ['id', 'number', 'patternId'] }) : null;
  if (!revision) throw notFound('Revision');
  return revision;
}

/** Comments on one revision, oldest first (owner and editor). */
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

/** Marks a comment resolved or open again (owner and editor). */
export async function setResolved(user: User | null, patternId: number, commentId: number, resolved: boolean): Promise<ApiComment> {
  const { pattern } = await authorizePattern(user, patternId, 'comment');
  const comment = Number.isSafeInteger(commentId) ? await Comment.findByPk(commentId, { include: [{ model: User, as: 'author' }, { model: Revision, as: 'revision', attributes: ['id', 'number', 'patternId'] }] }) : null;
  const revision = (comment as (Comment & { revision?: Revision }) | null)?.revision;
  if (!comment || !revision || revision.patternId !== pattern.id) throw notFound('That comment');
  comment.resolved = resolved;
  await comment.save();
  return toApiComment(comment, revision.number);
}
