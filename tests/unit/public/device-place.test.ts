import { describe, expect, it } from 'vitest';
import { scheduleSchema, type ScheduleInput } from '../../../shared/schemas/schedule.js';
import { publicBoardSchema, type PublicBoard } from '../../../shared/schemas/public-board.js';
import { toPublicBoard, type PublicBoardMeta } from '../../../shared/public/board-page.js';
import { devicePlaceText, ordinal, rowText, wayPlaceSentence, wayTextsByPlace } from '../../../shared/public/device-place.js';
import { AS_RECORDED_CAUTION, COVER_CAUTION, GENERAL_CAUTIONS, SWITCH_ONLY_CAUTIONS } from '../../../shared/public/cautions.js';
import { demoSites } from '../../../server/seed/demo-data.js';

const meta: PublicBoardMeta = {
  organisation: { name: 'Lanternfield Electrical', contactPhone: '', contactEmail: '' },
  hasLogo: false,
  revision: 1,
  revisionDate: '2026-01-05',
  nextInspectionOn: null,
};
const page = (schedule: ScheduleInput): PublicBoard => publicBoardSchema.parse(toPublicBoard(scheduleSchema.parse(schedule), meta));
const demo = (key: string) => demoSites.flatMap((s) => s.boards).find((b) => b.key === key)!.schedule;

/**
 * An invented two-row split-load board. Top row: RCD 1, then ways 1, 3 and 2, a blank cover, way 6.
 * Second row: the main switch, way 7, RCD 2, way 4, and way 5 on a 2-pole RCBO two modules wide.
 */
const twoRows: ScheduleInput = {
  board: { name: 'Landing consumer unit', rows: 2, modulesPerRow: 12, supply: { earthing: 'TN-C-S' } },
  devices: [
    { id: 'rcd1', row: 1, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
    { id: 'b32', row: 1, kind: 'mcb', rating: 32, curve: 'B' },
    { id: 'b16', row: 1, kind: 'mcb', rating: 16, curve: 'B' },
    { id: 'b6', row: 1, kind: 'mcb', rating: 6, curve: 'B' },
    { id: 'gap', row: 1, kind: 'blank' },
    { id: 'b20', row: 1, kind: 'mcb', rating: 20, curve: 'B' },
    { id: 'main', row: 2, kind: 'main-switch', modules: 2, poles: 2, rating: 100, label: 'Main switch' },
    { id: 'b10', row: 2, kind: 'mcb', rating: 10, curve: 'B' },
    { id: 'rcd2', row: 2, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A', label: 'Upstairs RCD' },
    { id: 'b40', row: 2, kind: 'mcb', rating: 40, curve: 'B' },
    { id: 'rcbo', row: 2, kind: 'rcbo', modules: 2, poles: 2, rating: 40, curve: 'B', residualMa: 30, rcdType: 'A' },
  ],
  circuits: [
    { id: 'c1', way: 1, deviceId: 'b32', label: 'Kitchen sockets' },
    { id: 'c2', way: 2, deviceId: 'b6', label: 'Lights' },
    { id: 'c3', way: 3, deviceId: 'b16', label: 'Garage sockets', locations: ['Garage'] },
    { id: 'c4', way: 4, deviceId: 'b40', label: 'Cooker' },
    { id: 'c5', way: 5, deviceId: 'rcbo', label: 'Shower' },
    { id: 'c6', way: 6, deviceId: 'b20', label: 'Loft sockets' },
    { id: 'c7', way: 7, deviceId: 'b10', label: 'Doorbell' },
    { id: 'c8', way: 8, label: 'Outside lights' },
  ],
};
const board = page(twoRows);
const where = (wayText: string) => {
  const way = board.ways.find((w) => w.wayText === wayText)!;
  return devicePlaceText(board.dinRows.rows, way.place!);
};

describe('where a way’s switch is, in words', () => {
  it('when the garage way is the third device on the top row, then it reads "3rd from the left on the top row, after RCD 1"', () => {
    expect(where('3')).toBe('3rd from the left on the top row, after RCD 1');
    expect(
      wayPlaceSentence(
        board.ways.find((w) => w.wayText === '3')!,
        board.dinRows.rows,
      ),
    ).toBe('The switch for way 3 (Garage sockets) is the MCB B16, 3rd from the left on the top row, after RCD 1.');
  });

  it('when a device is first, in the middle or last on its row, then it is counted from the left and the last says so', () => {
    const first = devicePlaceText(board.dinRows.rows, { row: 1, index: 0 });
    expect(first).toBe('1st from the left on the top row — a 2-pole device, 2 modules wide'); // RCD 1 itself: no RCD before it
    expect(where('1')).toBe('2nd from the left on the top row, after RCD 1');
    expect(where('2')).toBe('4th from the left on the top row, after RCD 1');
    // The blank cover switches nothing, so it is not counted: way 6 is the 5th device a person counts.
    expect(where('6')).toBe('5th and last from the left (not counting blank covers) on the top row, after RCD 1');
  });

  it('when the board has several rows, then the lower row is named "2nd row", counted from the top', () => {
    expect(where('4')).toBe('4th from the left on the 2nd row, after Upstairs RCD');
    expect(rowText(1, 3)).toBe('the top row');
    expect(rowText(3, 3)).toBe('the 3rd row');
    expect(rowText(1, 1)).toBe('');
  });

  it('when a device sits before any RCD on its row, then it names the RCD it comes before', () => {
    expect(where('7')).toBe('2nd from the left on the 2nd row, before Upstairs RCD');
    // No RCD on the row at all: nothing about RCDs.
    const flat = page(demo('flat-main'));
    expect(
      wayPlaceSentence(
        flat.ways.find((w) => w.wayText === '8')!,
        flat.dinRows.rows,
      ),
    ).toBe('The switch for way 8 (Garden studio) is the RCBO B32 100 mA, 10th from the left.');
  });

  it('when the device takes two or more modules or poles, then it counts as one device and its size is said', () => {
    expect(where('5')).toBe('5th and last from the left on the 2nd row, after Upstairs RCD — a 2-pole device, 2 modules wide');
    // The workshop's way 1 is a 3-pole C20 three modules wide, after a 4-pole main switch four modules wide.
    const workshop = page(demo('workshop'));
    const way1 = workshop.ways.find((w) => w.wayText === '1')!;
    expect(devicePlaceText(workshop.dinRows.rows, way1.place!)).toBe('2nd from the left on the top row — a 3-pole device, 3 modules wide');
    expect(devicePlaceText(workshop.dinRows.rows, workshop.ways.find((w) => w.wayText === '4 L2')!.place!)).toBe('2nd from the left on the 2nd row');
  });

  it('when a row holds one device, or the way has no device recorded, then it says so plainly', () => {
    const single = page({
      ...twoRows,
      board: { ...twoRows.board, rows: 1 },
      devices: [{ id: 'b6', row: 1, kind: 'mcb', rating: 6, curve: 'B' }],
      circuits: [],
    });
    expect(devicePlaceText(single.dinRows.rows, { row: 1, index: 0 })).toBe('the only device on the board');
    expect(devicePlaceText(board.dinRows.rows, { row: 1, index: 99 })).toBeNull();
    const outside = board.ways.find((w) => w.wayText === '8')!;
    expect(outside.place).toBeNull();
    expect(wayPlaceSentence(outside, board.dinRows.rows)).toBe('Where the switch for way 8 (Outside lights) sits on the board is not recorded.');
  });

  it('when numbers are written as ordinals, then 11th to 13th keep "th"', () => {
    expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 23, 101, 111, 112].map(ordinal)).toEqual([
      '1st',
      '2nd',
      '3rd',
      '4th',
      '11th',
      '12th',
      '13th',
      '21st',
      '22nd',
      '23rd',
      '101st',
      '111th',
      '112th',
    ]); // English ordinal suffixes (common practice)
  });

  it('when a spare device sits on the rail, then the spare way points at it like any other', () => {
    const withSpare = page({ ...twoRows, devices: [...twoRows.devices, { id: 'spare', row: 1, kind: 'mcb', rating: 6, curve: 'B' }] });
    const spare = withSpare.ways.find((w) => w.spare)!;
    expect(spare.place).toEqual({ row: 1, index: 6 });
    // It follows way 6 on the rail, but way 7 is taken, so the spare has no number.
    expect(spare.wayText).toBe('');
    expect(wayPlaceSentence(spare, withSpare.dinRows.rows)).toBe(
      'The switch for the spare way is the MCB B6, 6th and last from the left (not counting blank covers) on the top row, after RCD 1.',
    );
  });

  it('when several ways share a device, then the picture writes all their numbers over it', () => {
    const numbers = wayTextsByPlace([
      { wayText: '4 L1', place: { row: 2, index: 0 } },
      { wayText: '4 L2', place: { row: 2, index: 0 } },
      { wayText: '5', place: null },
    ]);
    expect([...numbers]).toEqual([['2:0', '4 L1, 4 L2']]);
  });
});

describe('the board page’s rows carry only what a visitor needs', () => {
  it('when the board is projected, then each device has its kind, width, poles, name and face, in rail order, and no id', () => {
    expect(board.dinRows.modulesPerRow).toBe(12);
    expect(board.dinRows.rows.map((r) => r.devices.map((d) => d.kind))).toEqual([
      ['rcd', 'mcb', 'mcb', 'mcb', 'blank', 'mcb'],
      ['main-switch', 'mcb', 'rcd', 'mcb', 'rcbo'],
    ]);
    expect(board.dinRows.rows[0].devices[0]).toEqual({ kind: 'rcd', modules: 2, poles: 2, label: 'RCD 1', face: { main: '63 A', sub: '30 mA A' } });
    expect(Object.keys(board.dinRows.rows[1].devices[4]).sort()).toEqual(['face', 'kind', 'label', 'modules', 'poles']);
    expect(board.ways.map((w) => [w.wayText, w.place])).toEqual([
      ['1', { row: 1, index: 1 }],
      ['2', { row: 1, index: 3 }],
      ['3', { row: 1, index: 2 }],
      ['4', { row: 2, index: 3 }],
      ['5', { row: 2, index: 4 }],
      ['6', { row: 1, index: 5 }],
      ['7', { row: 2, index: 1 }],
      ['8', null],
    ]);
  });

  it('when a board says it has more rows than hold devices, then the empty rows are still drawn', () => {
    const three = page({ ...twoRows, board: { ...twoRows.board, rows: 3 } });
    expect(three.dinRows.rows.map((r) => r.devices.length)).toEqual([6, 5, 0]);
  });
});

describe('the cautions beside the switch locator', () => {
  it('when the locator shows, then its cautions say switching is as far as it goes and reuse the page’s own wording for the cover and the record', () => {
    expect(SWITCH_ONLY_CAUTIONS[0]).toMatch(/^Switching this device off or on, at its front, is as far as you should go/);
    expect(SWITCH_ONLY_CAUTIONS[1].startsWith(COVER_CAUTION)).toBe(true);
    expect(SWITCH_ONLY_CAUTIONS).toContain(AS_RECORDED_CAUTION);
    // The same sentences as the general cautions, not a second wording of them.
    expect(GENERAL_CAUTIONS).toContain(COVER_CAUTION);
    expect(GENERAL_CAUTIONS).toContain(AS_RECORDED_CAUTION);
  });
});
