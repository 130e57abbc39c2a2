/** Typed calls for the organisation's own settings (name and contact shown on printed charts) and its notice wording. */
import { organisationSchema, type Organisation, type OrganisationSave } from '../../shared/schemas/organisation.js';
import { noticeWordingListSchema, type NoticeWordingList, type NoticeWordingSave } from '../../shared/schemas/notice-wording.js';
import { json } from './http.js';

export async function fetchOrganisation(): Promise<Organisation> {
  return json(organisationSchema, 'GET', '/api/organisation');
}

/** Saves against `save.baseRevision`; settings saved by someone else since answer 409 (`ApiError.code === 'stale'`). */
export async function saveOrganisation(save: OrganisationSave): Promise<Organisation> {
  return json(organisationSchema, 'PUT', '/api/organisation', { body: save });
}

/** The notices an organisation may reword: prescribed words, its own, the regulation; and the revision to save against. */
export async function fetchNoticeWording(): Promise<NoticeWordingList> {
  return json(noticeWordingListSchema, 'GET', '/api/organisation/notice-wording');
}

/** One notice's wording, or `wording: null` for the prescribed words; shares the organisation's revision (409 `stale`). */
export async function saveNoticeWording(save: NoticeWordingSave): Promise<NoticeWordingList> {
  return json(noticeWordingListSchema, 'PUT', '/api/organisation/notice-wording', { body: save });
}
