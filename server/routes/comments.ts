/** Review comments: /api/patterns/:id/revisions/:number/comments and /api/patterns/:id/comments/:commentId. */
import { Router } from 'express';
import { createCommentBody, replyBody, updateCommentBody } from '../../shared/api-schemas.ts';
import { requireUser } from '../services/access.ts';
import { addComment, listComments, replyToComment, setResolved } from '../services/comments.ts';
import { intParam, parseBody } from './params.ts';

/** Comment routes; access is decided by the `comment` action of the policy. */
export function commentRoutes(): Router {
  const r = Router();
  r.get('/patterns/:id/revisions/:number/comments', async (req, res) => {
    res.json({ comments: await listComments(req.user, intParam(req.params.id), intParam(req.params.number)) });
  });
  r.post('/patterns/:id/revisions/:number/comments', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(createCommentBody, req.body);
    res.status(201).json({ comment: await addComment(req.user, intParam(req.params.id), intParam(req.params.number), body) });
  });
  r.patch('/patterns/:id/comments/:commentId', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(updateCommentBody, req.body);
    res.json({ comment: await setResolved(req.user, intParam(req.params.id), intParam(req.params.commentId), body.resolved) });
  });
  r.post('/patterns/:id/comments/:commentId/replies', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(replyBody, req.body);
    res.status(201).json({ comment: await replyToComment(req.user, intParam(req.params.id), intParam(req.params.commentId), body.body) });
  });
  return r;
}
