import { describe, expect, it } from 'vitest';
import { scheduleSchema, type ScheduleInput } from '../../../shared/schemas/schedule.js';
import { publicBoardSchema } from '../../../shared/schemas/public-board.js';
import { toPublicBoard, type PublicBoardMeta } from '../../../shared/public/board-page.js';
import { GENERAL_CAUTIONS, THREE_PHASE_CAUTION } from '../../../shared/public/cautions.js';
import { supplyVoltages, supplyVoltageText } from '../../../shared/schedule/voltage.js';
import { isOverdue, localIsoDay } from '../../../shared/public/dates.js';
import { listText, unprotectedText, wayProtectionText } from '../../../shared/public/way-text.js';
import { nextInspectionDate } from '../../../shared/rules/index.js';
import { demoSites } from '../../../server/seed/demo-data.js';

const meta: PublicBoardMeta = {
  organisation: { name: 'Lanternfield Electrical', contactPhone: '', contactEmail: '' },
  hasLogo: false,
  revision: 1,
  revisionDate: '2026-01-05',
  nextInspectionOn: null,
};
const demo = (key: string) => demoSites.flatMap((s) => s.boards).find((b) => b.key === key)!.schedule;
const page = (schedule = demo('flat-main'), extra: Partial<PublicBoardMeta> = {}) => publicBoardSchema.parse(toPublicBoard(schedule, { ...meta, ...extra }));

/** A small board from the parts a test cares about, parsed by the real schema. */
function board(parts: Partial<ScheduleInput['board']>, circuits: ScheduleInput['circuits'], devices: ScheduleInput['devices'] = []) {
  return scheduleSchema.parse({ board: { name: 'Test board', supply: { earthing: 'TN-S' }, ...parts }, devices, circuits });
}

describe('three-phase boards on the board page', () => {
  it('when the board has three phases, then the 400 V caution comes right after "isolate and prove dead"', () => {
    const workshop = page(demo('workshop'));
    // BS 7671 514.10.1 (found): warn where more than 230 V to earth would not normally be expected.
    expect(workshop.cautions[1]).toBe(THREE_PHASE_CAUTION);
    expect(THREE_PHASE_CAUTION).toMatch(/400 V is present between the phases/);
    for (const caution of GENERAL_CAUTIONS) expect(workshop.cautions).toContain(caution);
  });

  it('when the board is single-phase, then no 400 V caution is shown', () => {
    expect(page().cautions.join(' ')).not.toMatch(/400 V/);
  });

  it('when a 230 V supply has three phases, then it reads 400/230 V, three-phase, 230 V to earth', () => {
    const supply = page(demo('workshop')).supply;
    // 230 V × √3 = 398 V, named 400 V: IEC 60038 nominal 230/400 V (from memory).
    expect(Math.round(230 * Math.sqrt(3))).toBe(398);
    expect(supply.betweenPhasesVoltage).toBe(400);
    expect(supply.voltageText).toBe('400/230 V (three-phase, 230 V to earth)');
    expect(supply.voltageText).not.toMatch(/^230 V/);
    expect(page().supply).toMatchObject({ betweenPhasesVoltage: null, voltageText: '230 V, single-phase' });
  });

  it('when a three-phase board records the voltage between phases, or an unusual one, then both figures still come out right', () => {
    // IEC 60038 nominal pairs 230/400 and 240/415 V (from memory); √3 × 100 = 173 (arithmetic).
    expect(supplyVoltages(3, 400)).toEqual({ toEarth: 230, betweenPhases: 400 });
    expect(supplyVoltageText(3, 240)).toBe('415/240 V (three-phase, 240 V to earth)');
    expect(supplyVoltages(3, 100)).toEqual({ toEarth: 100, betweenPhases: 173 });
    expect(supplyVoltageText(1, 230)).toBe('230 V, single-phase');
  });

  it('when both an alternative supply and three phases are present, then both cautions lead, the 400 V one first', () => {
    const cautions = page(board({ phases: 3, alternativeSupply: { present: true, kinds: ['pv'] } }, [])).cautions;
    expect(cautions[0]).toBe(GENERAL_CAUTIONS[0]);
    expect(cautions[1]).toBe(THREE_PHASE_CAUTION);
    // BS 7671 514.15.1 (from memory): isolate every source.
    expect(cautions[2]).toMatch(/another source of supply \(solar PV\)/);
  });
});

describe('sub-mains on the board page', () => {
  it('when a way is the sub-main to the studio, then it is marked as feeding another board and its RCBO text says the whole board goes off', () => {
    const flat = page();
    const studio = flat.ways.find((w) => w.label === 'Garden studio')!;
    expect(studio.feedsAnotherBoard).toBe(true);
    expect(wayProtectionText(studio)).toBe('Own RCBO 100 mA: when it trips, this way and everything on the board it feeds go off');
    expect(wayProtectionText(studio)).not.toMatch(/only this way/);
    expect(flat.ways.filter((w) => w.feedsAnotherBoard).map((w) => w.wayText)).toEqual([studio.wayText]);
  });

  it('when a sub-main sits behind a shared RCD, then its RCD group entry and card both say the fed board goes off', () => {
    const schedule = board(
      { rcdMode: 'position' },
      [
        { id: 'a', way: 1, deviceId: 'b6', label: 'Lights' },
        { id: 'b', way: 2, deviceId: 'b32', label: 'Garage board', feedsBoardId: 77 },
      ],
      [
        { id: 'rcd', row: 1, kind: 'rcd', rating: 63, residualMa: 30 },
        { id: 'b6', row: 1, kind: 'mcb', rating: 6, curve: 'B' },
        { id: 'b32', row: 1, kind: 'mcb', rating: 32, curve: 'B' },
      ],
    );
    const p = page(schedule);
    // The link is only a flag: the other board's id stays private.
    expect(JSON.stringify(p)).not.toContain('77');
    expect(p.rcdGroups[0].ways).toEqual([
      { wayText: '1', label: 'Lights', feedsAnotherBoard: false },
      { wayText: '2', label: 'Garage board', feedsAnotherBoard: true },
    ]);
    expect(wayProtectionText(p.ways[1])).toBe('Goes off when RCD 1 30 mA trips, and so does everything on the board it feeds');
    expect(wayProtectionText(p.ways[0])).toBe('Goes off when RCD 1 30 mA trips');
  });
});

describe('overdue inspection', () => {
  const workshopNext = nextInspectionDate(demo('workshop').board);

  it('when the recommended date is before today, then overdue; on the day itself or later, not', () => {
    // IET Guidance Note 3 (found in secondary sources; see docs/sources.md): industrial, 3 years from 8 November 2022.
    expect(workshopNext).toBe('2025-11-08');
    expect(isOverdue(workshopNext, '2025-11-09')).toBe(true);
    expect(isOverdue(workshopNext, '2025-11-08')).toBe(false);
    expect(isOverdue(workshopNext, '2025-11-07')).toBe(false);
    expect(isOverdue(null, '2030-01-01')).toBe(false);
  });

  it('when the page is built, then its JSON carries no today: the same revision builds the same page on any day', () => {
    const json = JSON.stringify(page(demo('workshop'), { nextInspectionOn: workshopNext }));
    expect(json).not.toMatch(/overdue/i);
    expect(json).toContain('"nextOn":"2025-11-08"');
  });

  it('when today is worked out, then it is the calendar day of the visitor, not of UTC', () => {
    const lateEvening = new Date(2025, 10, 8, 23, 30); // local time, month 10 = November
    expect(localIsoDay(lateEvening)).toBe('2025-11-08');
  });
});

describe('ways without RCD protection', () => {
  it('when one way or several have none, then the sentence says way or ways and lists them in English', () => {
    // English plural and list "1, 2 and 3" (common practice).
    expect(unprotectedText(['4'])).toBe('No RCD protection is recorded for way 4.');
    expect(unprotectedText(['1', '2', '3'])).toBe('No RCD protection is recorded for ways 1, 2 and 3.');
    expect(unprotectedText(['1 L1', '1 L2'])).toBe('No RCD protection is recorded for ways 1 L1 and 1 L2.');
    expect(unprotectedText([])).toBe('');
    expect(listText(['a'])).toBe('a');
  });
});

describe('the survey of an old board on the board page', () => {
  it('when a board carries a survey, then nothing of it reaches the public projection', () => {
    const bungalow = demo('bungalow');
    expect(bungalow.survey?.ways.length).toBeGreaterThan(0);
    const json = JSON.stringify(page(bungalow));
    for (const secret of ['survey', 'JB1', 'Fuse 1', 'cable cut off', 'BS 3036', bungalow.survey!.notes]) expect(json).not.toContain(secret);
  });
});
