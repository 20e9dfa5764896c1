/**
 * Request schemas and response types of the HTTP API, shared by the server
 * (which validates every body with these) and the client (which can run the
 * same checks before sending). Plain zod; no DOM, no Node APIs.
 *
 * Errors from the API are always {@link ApiErrorBody}. A body that fails one
 * of these schemas is answered with 400 and code `invalid-request`, with the
 * zod issues in `details` as `{ path, message }[]`.
 */
import { z } from 'zod';

/** Largest pattern source accepted, in UTF-8 bytes (1 MiB). Larger saves get 413. */
export const SOURCE_MAX_BYTES = 1024 * 1024;
/** Largest swatch photo, in bytes (5 MiB). Larger uploads get 413. */
export const PHOTO_MAX_BYTES = 5 * 1024 * 1024;
/** Content types accepted for swatch photos (checked by content, not by name). */
export const PHOTO_TYPES = ['image/png', 'image/jpeg', 'image/webp'] as const;
/** Roles a person can hold on one pattern besides the owner. */
export const MEMBER_ROLES = ['editor', 'test-knitter', 'knitter'] as const;
/** Review status of a pattern. */
export const PATTERN_STATUSES = ['draft', 'in-review', 'changes-requested', 'approved', 'released'] as const;

const email = z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address.' })).pipe(z.string().max(254));
/** bcrypt reads at most 72 bytes; longer passwords would be silently cut, so they are refused. */
const password = z
  .string()
  .min(10, { message: 'Use at least 10 characters for the password.' })
  .refine((p) => new TextEncoder().encode(p).length <= 72, { message: 'Use at most 72 bytes for the password.' });
const name = z.string().trim().min(1, { message: 'Enter a name.' }).max(120);
const title = z.string().trim().min(1, { message: 'Give the pattern a title.' }).max(200);

export const registerBody = z.object({ email, password, name });
export const loginBody = z.object({ email, password: z.string().min(1).max(200) });
export const passwordResetRequestBody = z.object({ email });
export const passwordResetBody = z.object({ password });

/** `source` is checked for size separately (413 instead of 400). */
export const createPatternBody = z.object({ title, source: z.string().optional() });
export const saveRevisionBody = z.object({
  source: z.string(),
  baseRevision: z.number().int().min(1),
  message: z.string().trim().max(500).default(''),
});
export const inviteMemberBody = z.object({ email, role: z.enum(MEMBER_ROLES) });
/** Name and password are needed only when the invited e-mail has no account yet. */
export const acceptInvitationBody = z.object({ name: name.optional(), password: password.optional() });
/**
 * Status changes: the owner submits (`in-review`), withdraws (`draft`) or
 * releases (`released`, only after approval); an invited editor approves
 * (`approved`) or requests changes (`draft`).
 */
export const changeStatusBody = z.object({
  status: z.enum(PATTERN_STATUSES),
  /** Why (asking for changes needs it on the review routes; optional here). */
  message: z.string().trim().max(5000).optional(),
  /** For `released`: the version label (see {@link RELEASE_LABEL}). */
  label: z.string().trim().optional(),
  /** For `approved`: the revision approved (default: the newest). */
  revision: z.number().int().min(1).optional(),
  /** For `in-review`: the invited editor asked to review (default: every invited editor). */
  editorId: z.number().int().min(1).optional(),
});

/**
 * Version labels of releases: one to three dot-separated numbers of up to
 * four digits ("1", "1.0", "1.1", "2.0.1"). Unique per pattern, and each new
 * label must be greater than every earlier one (compared number by number).
 */
export const RELEASE_LABEL = /^(0|[1-9][0-9]{0,3})(\.(0|[1-9][0-9]{0,3})){0,2}$/;
const releaseLabel = z.string().trim().regex(RELEASE_LABEL, { message: 'Use a version label such as 1.0 or 1.1 (numbers separated by dots).' });
const message = z.string().trim().min(1, { message: 'Write a message.' }).max(5000);

/** Owner asks for a review of `revision` (default: the newest) by one invited editor (default: all of them). */
export const requestReviewBody = z.object({
  editorId: z.number().int().min(1).optional(),
  revision: z.number().int().min(1).optional(),
  message: z.string().trim().max(5000).optional(),
});
/** Editor approves `revision` (default: the newest). */
export const approveBody = z.object({ revision: z.number().int().min(1).optional(), message: z.string().trim().max(5000).optional() });
/** Editor asks for changes; the message is mailed to the designer. */
export const requestChangesBody = z.object({ message, revision: z.number().int().min(1).optional() });
/** Owner releases the approved revision under `label`; `revision`, when given, must be the approved one. */
export const releaseBody = z.object({ label: releaseLabel, revision: z.number().int().min(1).optional(), notes: z.string().trim().max(1000).optional() });
/** A reply in a comment thread. */
export const replyBody = z.object({ body: z.string().trim().min(1, { message: 'Write something.' }).max(5000) });
/** A knitter's place in a release for one size: rounds marked done and the current round. */
export const progressBody = z.object({
  roundsDone: z.array(z.number().int().min(1)).max(100_000),
  currentRound: z.number().int().min(1).nullable(),
});
/** An erratum on a round of a release (optionally for one size). */
export const erratumBody = z.object({
  round: z.number().int().min(1),
  size: z.string().trim().min(1).max(100).optional(),
  body: z.string().trim().min(1, { message: 'Describe the problem.' }).max(5000),
});
/** Export formats. */
export const EXPORT_FORMATS = ['pdf', 'txt', 'svg', 'png'] as const;
/** Query of an export (GET .../export) or body of an export job (POST .../exports). */
export const exportRequest = z.object({
  format: z.enum(EXPORT_FORMATS, { message: 'format must be one of pdf, txt, svg, png.' }),
  size: z.string().trim().min(1).max(100).optional(),
  view: z.enum(['front', 'back']).default('front'),
});
const revisionNumber = z.string().regex(/^[1-9][0-9]{0,9}$/, { message: 'Give a revision number (1, 2, ...).' }).transform(Number);
/** Query of GET /api/patterns/:id/diff. */
export const diffQuery = z.object({ from: revisionNumber, to: revisionNumber, size: z.string().trim().min(1).max(100).optional() });
export const createCommentBody = z
  .object({
    body: z.string().trim().min(1, { message: 'Write something.' }).max(5000),
    round: z.number().int().min(1).optional(),
    fromLine: z.number().int().min(1).optional(),
    toLine: z.number().int().min(1).optional(),
  })
  .refine((c) => c.fromLine === undefined || c.toLine === undefined || c.toLine >= c.fromLine, {
    message: 'toLine must not be before fromLine.',
    path: ['toLine'],
  });
export const updateCommentBody = z.object({ resolved: z.boolean() });
export const adminUpdateUserBody = z.object({ roles: z.array(z.enum(['designer', 'editor', 'knitter', 'admin'])) });

export type RegisterBody = z.infer<typeof registerBody>;
export type LoginBody = z.infer<typeof loginBody>;
export type CreatePatternBody = z.infer<typeof createPatternBody>;
export type SaveRevisionBody = z.input<typeof saveRevisionBody>;
export type InviteMemberBody = z.infer<typeof inviteMemberBody>;
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBody>;
export type ChangeStatusBody = z.infer<typeof changeStatusBody>;
export type CreateCommentBody = z.infer<typeof createCommentBody>;

export type MemberRoleName = (typeof MEMBER_ROLES)[number];
export type PatternStatusName = (typeof PATTERN_STATUSES)[number];
/** The caller's relation to a pattern. */
export type MyRole = 'owner' | MemberRoleName;

/** `{"error":{...}}`; a 409 on save also carries `latest`. */
export interface ApiErrorBody { error: { code: string; message: string; details?: unknown } }

export interface ApiUser { id: number; email: string; name: string; roles: string[] }
export interface ApiPerson { id: number; name: string }
/** Compile summary stored with each revision (from the shared compiler). */
export interface ApiSummary {
  errors: number;
  warnings: number;
  sizes: { name: string; rounds: { number: number; front: number; backing: number; total: number }[] }[];
}
export interface ApiPattern {
  id: number;
  title: string;
  status: PatternStatusName;
  owner: ApiPerson;
  /** Newest revision number the caller may see. */
  latestRevision: number;
  approvedRevision: number | null;
  releasedRevision: number | null;
  myRole: MyRole;
  createdAt: string;
  updatedAt: string;
}
export interface ApiPatternListItem {
  id: number;
  title: string;
  status: PatternStatusName;
  sizes: string[];
  latestRevision: number;
  latestAuthor: ApiPerson;
  errors: number;
  warnings: number;
  updatedAt: string;
  myRole: MyRole;
}
/** A revision; `source` and `summary` are present on single-revision answers. */
export interface ApiRevision {
  id: number;
  number: number;
  message: string;
  author: ApiPerson;
  errors: number;
  warnings: number;
  createdAt: string;
  source?: string;
  summary?: ApiSummary | null;
}
export interface ApiMember { user: ApiPerson & { email: string }; role: MyRole; since: string }
export interface ApiInvitation { id: number; email: string; role: MemberRoleName; expiresAt: string; acceptedAt: string | null; createdAt: string }
export interface ApiUpload { id: number; kind: 'swatch' | 'source'; originalName: string; mimeType: string; size: number; url: string; createdAt: string }
export interface ApiComment {
  id: number;
  revision: number;
  author: ApiPerson;
  round: number | null;
  fromLine: number | null;
  toLine: number | null;
  body: string;
  resolved: boolean;
  createdAt: string;
  /** The thread's first comment when this is a reply; null for a thread. */
  parentId?: number | null;
  /** `erratum`: reported by a knitter on a released revision. */
  kind?: 'comment' | 'erratum';
  /** Size an erratum is about, if any. */
  size?: string | null;
}
/** A release: a frozen revision under a version label. */
export interface ApiRelease { id: number; label: string; revision: number; notes: string; releasedBy: ApiPerson; releasedAt: string }
/** One step of the review log. */
export interface ApiReviewEvent {
  id: number;
  event: 'submit' | 'withdraw' | 'approve' | 'request-changes' | 'release';
  from: PatternStatusName;
  to: PatternStatusName;
  revision: number | null;
  actor: ApiPerson;
  editor: ApiPerson | null;
  message: string | null;
  createdAt: string;
}
/** A knitter's progress in one release and size. */
export interface ApiProgress { release: string; revision: number; size: string; rounds: number; roundsDone: number[]; currentRound: number | null; updatedAt: string | null }
/** An export job (POST .../exports, GET /api/exports/:job). */
export interface ApiExportJob {
  id: string;
  state: 'queued' | 'running' | 'done' | 'failed';
  /** 0..1. */
  progress: number;
  format: (typeof EXPORT_FORMATS)[number];
  /** Download URL once done, else null. */
  url: string | null;
  filename: string;
  error: { code: string; message: string } | null;
}
/** A mail caught by the local fake SMTP server; `to` is a comma-separated list of addresses. */
export interface ApiOutboxMessage { id: string; to: string; subject: string; text: string; html: string; links: string[]; receivedAt: string }
