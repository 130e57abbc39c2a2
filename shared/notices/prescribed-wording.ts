/**
 * The words BS 7671 prescribes for the notices an organisation may reword, as the default of each, and
 * the regulation printed on the notice whatever its wording. Recalled wording is marked `// from memory`
 * and listed in docs/sources.md as "to check against the printed standard": where two independent
 * published transcriptions agreed with the recollection, docs/sources.md says so.
 */
import type { EditableNoticeKind, NoticeWording, NoticeWordingSet } from '../schemas/notice-wording.js';

export interface PrescribedNotice {
  regulation: string;
  wording: NoticeWording;
  /** Whether the heading is the standard's word too (else it is Waymark's, the body alone being prescribed). */
  titlePrescribed: boolean;
}

export const prescribedNotices: Record<EditableNoticeKind, PrescribedNotice> = {
  // BS 7671:2018+A2 Regulation 514.12.1 // from memory (to check against the printed standard)
  inspection: {
    regulation: 'BS 7671 514.12.1',
    titlePrescribed: true,
    wording: {
      title: 'Important',
      body: 'This installation should be periodically inspected and tested and a report on its condition obtained, as prescribed in BS 7671 Requirements for Electrical Installations.',
    },
  },
  // BS 7671:2018+A2 Regulation 514.12.2 // from memory (to check against the printed standard); the heading is ours
  'rcd-test': {
    regulation: 'BS 7671 514.12.2',
    titlePrescribed: false,
    wording: {
      title: 'Test the RCDs every six months',
      body: 'This installation, or part of it, is protected by a device which automatically switches off the supply if a fault develops. Test six-monthly by pressing the relevant test button(s) which should operate the device. Afterwards, manually switch on the device. If the device does not operate, or indicates a fault, seek expert advice.',
    },
  },
  // BS 7671:2018+A2 Regulation 514.14.1 // from memory (to check against the printed standard, which may have withdrawn it)
  'mixed-colours': {
    regulation: 'BS 7671 514.14.1',
    titlePrescribed: true,
    wording: {
      title: 'Caution',
      body: 'This installation has wiring colours to two versions of BS 7671. Great care should be taken before undertaking extension, alteration or repair that all conductors are correctly identified.',
    },
  },
};

/** The "Date of last inspection" and "Recommended date of next inspection" lines of 514.12.1. // from memory */
export const INSPECTION_DATE_LABELS = { last: 'Date of last inspection', next: 'Recommended date of next inspection' } as const;

/**
 * The wording a notice prints for an organisation: its own when it has one, else the prescribed words.
 * Line breaks typed into the wording print as spaces (the notice sets one paragraph).
 */
export function noticeWordingFor(kind: EditableNoticeKind, own: NoticeWordingSet | null | undefined): NoticeWording {
  return own?.[kind] ?? prescribedNotices[kind].wording;
}
