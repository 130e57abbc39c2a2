/**
 * One organisation's share of this process's render threads and their queue. Without it, one member
 * asking for the largest chart over and over fills the queue (threads × 16 places) and every other
 * contractor gets "busy" until those prints are done. A share of four covers one person's print page
 * (the preview, its warnings and a download at once) with room to spare.
 */
import { AppError } from '../../errors.js';

/** Prints of one organisation rendering or waiting at once in one process. // common practice: a few per user-facing action */
export const PRINTS_AT_ONCE_PER_ORGANISATION = 4;
const RETRY_AFTER_SECONDS = 5;

export const organisationBusy = () =>
  new AppError(503, 'print_busy', 'Your organisation already has several prints rendering; try again in a moment', undefined, {
    'Retry-After': String(RETRY_AFTER_SECONDS),
  });

const inFlight = new Map<number, number>();

/** Runs `work` within the organisation's share, or refuses at once with 503 print_busy when the share is taken. */
export async function withinOrganisationShare<T>(organisationId: number, work: () => Promise<T>, share = PRINTS_AT_ONCE_PER_ORGANISATION): Promise<T> {
  const running = inFlight.get(organisationId) ?? 0;
  if (running >= share) throw organisationBusy();
  inFlight.set(organisationId, running + 1);
  try {
    return await work();
  } finally {
    const left = (inFlight.get(organisationId) ?? 1) - 1;
    if (left > 0) inFlight.set(organisationId, left);
    else inFlight.delete(organisationId);
  }
}
