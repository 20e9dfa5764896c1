/**
 * Demo review state for local runs (`npm start`), after seedDemo: the
 * technical editor (Idris Penhale) is invited as editor on every demo
 * pattern, the test knitter Bram Ottery on every demo pattern, and the
 * knitter Sorrel Quayle as a test knitter on every demo pattern except the
 * released Lantern Mitts, which she can buy in the shop (the demo of a
 * purchase). The Lantern Mitts are reviewed, approved and released as
 * version 1.0, with the steps in the review log. Idempotent: existing
 * memberships and releases are left alone. Local demo data only.
 */
import type { Sequelize } from 'sequelize';
import { Membership, Pattern, Release, Revision, ReviewEvent, User } from '../models/index.ts';

/** The demo pattern released as 1.0. */
export const DEMO_RELEASED_TITLE = 'Lantern Mitts';

/** Demo memberships; `except` names a pattern the person is deliberately not a member of. */
const MEMBERS: readonly { email: string; role: 'editor' | 'test-knitter'; except?: string }[] = [
  { email: 'editor@saltmarsh.example', role: 'editor' },
  { email: 'knitter@saltmarsh.example', role: 'test-knitter', except: DEMO_RELEASED_TITLE },
  { email: 'knitter2@saltmarsh.example', role: 'test-knitter' },
];

/** Adds the demo memberships and release; returns how many memberships and releases it added. */
export async function seedReviewDemo(sequelize: Sequelize): Promise<{ memberships: number; releases: number }> {
  const designer = await User.findOne({ where: { email: 'designer@saltmarsh.example' } });
  if (!designer) return { memberships: 0, releases: 0 };
  let memberships = 0;
  let releases = 0;
  const patterns = await Pattern.findAll({ where: { ownerId: designer.id } });
  for (const m of MEMBERS) {
    const user = await User.findOne({ where: { email: m.email } });
    if (!user) continue;
    for (const p of patterns) {
      if (p.title === m.except) continue;
      const [, created] = await Membership.findOrCreate({ where: { patternId: p.id, userId: user.id }, defaults: { patternId: p.id, userId: user.id, role: m.role } });
      if (created) memberships++;
    }
  }
  const editor = await User.findOne({ where: { email: 'editor@saltmarsh.example' } });
  const mitts = patterns.find((p) => p.title === DEMO_RELEASED_TITLE);
  if (editor && mitts && mitts.status === 'draft' && (await Release.count({ where: { patternId: mitts.id } })) === 0) {
    const revision = await Revision.findOne({ where: { patternId: mitts.id, number: 1 }, attributes: ['id', 'number'] });
    if (revision) {
      await sequelize.transaction(async (transaction) => {
        const log = (actorId: number, event: 'submit' | 'approve' | 'release', fromStatus: string, toStatus: string, message: string | null) =>
          ReviewEvent.create({ patternId: mitts.id, actorId, event, fromStatus, toStatus, revisionNumber: 1, editorId: event === 'submit' ? editor.id : null, message }, { transaction });
        await log(designer.id, 'submit', 'draft', 'in-review', 'Ready for a technical edit.');
        await log(editor.id, 'approve', 'in-review', 'approved', 'Counts check out in every size.');
        await Release.create({ patternId: mitts.id, revisionId: revision.id, revisionNumber: 1, label: '1.0', notes: 'First release.', releasedById: designer.id }, { transaction });
        await log(designer.id, 'release', 'approved', 'released', null);
        mitts.status = 'released';
        mitts.releasedRevision = 1;
        mitts.approvedRevision = null;
        await mitts.save({ transaction });
      });
      releases++;
    }
  }
  return { memberships, releases };
}
