/**
 * The organisation's notice wording: read by every member (they print), changed by the owner. One
 * notice is saved or reset at a time against the organisation's revision, so two owners rewording
 * different notices at once cannot overwrite each other unseen: the second is 409 `stale`.
 */
import type { Db } from '../db/client.js';
import { editableNoticeKinds, type NoticeWordingList, type NoticeWordingSave, type NoticeWordingSet } from '../../shared/schemas/notice-wording.js';
import { prescribedNotices } from '../../shared/notices/prescribed-wording.js';
import { notFound, stale } from '../errors.js';
import { findNoticeWording, updateNoticeWordingIfAt } from './repository.js';

function listOf(wording: NoticeWordingSet, revision: number): NoticeWordingList {
  return {
    revision,
    notices: editableNoticeKinds.map((kind) => ({
      kind,
      regulation: prescribedNotices[kind].regulation,
      prescribed: prescribedNotices[kind].wording,
      custom: wording[kind] ?? null,
    })),
  };
}

export async function noticeWordingOf(db: Db, organisationId: number): Promise<NoticeWordingList> {
  const found = await findNoticeWording(db, organisationId);
  if (!found) throw notFound('No such organisation');
  return listOf(found.wording, found.revision);
}

/**
 * Sets one notice's wording, or with `wording: null` goes back to the prescribed words; the other
 * notices keep theirs. Refused as stale (409 with the current revision) if the organisation moved on.
 */
export async function saveNoticeWording(db: Db, organisationId: number, save: NoticeWordingSave): Promise<NoticeWordingList> {
  const current = await findNoticeWording(db, organisationId);
  if (!current) throw notFound('No such organisation');
  if (current.revision !== save.baseRevision) throw stale('organisation', current.revision);
  const next: NoticeWordingSet = { ...current.wording };
  if (save.wording) next[save.kind] = save.wording;
  else delete next[save.kind];
  const won = await updateNoticeWordingIfAt(db, organisationId, save.baseRevision, next);
  const after = await findNoticeWording(db, organisationId);
  if (!won || !after) throw stale('organisation', after?.revision ?? current.revision);
  return listOf(after.wording, after.revision);
}
