import { describe, expect, it } from 'vitest';
import { toPublicBoard } from '../../../shared/public/board-page.js';
import { queryWords, searchWays } from '../../../shared/public/search.js';
import { demoSites } from '../../../server/seed/demo-data.js';

const meta = {
  organisation: { name: 'Lanternfield Electrical', contactPhone: '', contactEmail: '' },
  hasLogo: false,
  revision: 1,
  revisionDate: '2026-01-05',
  nextInspectionOn: null,
};
const demo = (key: string) => toPublicBoard(demoSites.flatMap((s) => s.boards).find((b) => b.key === key)!.schedule, meta);
const flat = demo('flat-main');
const workshop = demo('workshop');
const found = (board: typeof flat, query: string) => searchWays(board.ways, query).map((w) => w.wayText);

describe('board page search by way', () => {
  it('when a visitor types "way 5" or just "5", then way 5 is found', () => {
    // Way numbers as the demo board's chart prints them (our demo data).
    expect(found(flat, 'way 5')).toEqual(['5']);
    expect(found(flat, 'Way 5')).toEqual(['5']);
    expect(found(flat, '5')).toContain('5');
    // 5 L3 is the demo workshop's spare way: a spare way is listed (and found) like any other.
    expect(found(workshop, 'way 5')).toEqual(['5 L1', '5 L2', '5 L3']);
  });

  it('when a visitor types a phase, or a way and a phase, then those ways are found', () => {
    expect(found(workshop, 'L1')).toEqual(['4 L1', '5 L1']);
    expect(found(workshop, 'way 4 L2')).toEqual(['4 L2']);
    expect(found(workshop, '4 L2')).toEqual(['4 L2']);
    expect(found(workshop, '4L2')).toEqual(['4 L2']);
    expect(found(workshop, 'way 4')).toEqual(['4 L1', '4 L2', '4 L3']);
  });

  it('when "way" is typed, then a number means the way only, not text that happens to contain it', () => {
    const ways = [
      { ...flat.ways[0], way: 1, wayText: '1', label: 'Bedroom 2 sockets', description: '', locations: [] },
      { ...flat.ways[1], way: 2, wayText: '2', label: 'Hall lights', description: '', locations: [] },
    ];
    expect(searchWays(ways, 'way 2').map((w) => w.wayText)).toEqual(['2']);
    // Without "way" the number still finds rooms named by number, as before.
    expect(searchWays(ways, '2').map((w) => w.wayText)).toEqual(['1', '2']);
  });

  it('when only "way" is typed (on the way to "way 5"), then every way still shows; a way the board lacks shows none', () => {
    expect(found(flat, 'way')).toHaveLength(flat.ways.length);
    expect(found(flat, 'way 42')).toEqual([]);
    expect(found(workshop, 'way 3 L2')).toEqual([]);
  });

  it('when a query is split into words, then "4l2" becomes a way and a phase', () => {
    expect(queryWords('Way 4L2')).toEqual(['way', '4', 'l2']);
  });
});
